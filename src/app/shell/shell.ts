import { LiveAnnouncer } from '@angular/cdk/a11y';
import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, viewChild } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDividerModule } from '@angular/material/divider';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenav, MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';
import { ServerInfoService } from '../api-client/server-info-service';
import { AuthService } from '../auth/auth-service';
import { NotificationBell } from '../notifications/notification-bell';
import { BrandMark } from './brand-mark';
import { CautionNote } from './caution-note';
import { navItemsFor } from './nav-items';
import { ROLE_LABELS } from './role-labels';

/** The signed-in frame: top bar, role-based side navigation, page outlet and the caution footer. */
@Component({
  selector: 'as-shell',
  imports: [
    RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatSidenavModule, MatButtonModule,
    MatIconModule, MatMenuModule, MatDividerModule, BrandMark, CautionNote, NotificationBell,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly auth = inject(AuthService);
  private readonly router = inject(Router);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly serverInfo = inject(ServerInfoService);
  private readonly main = viewChild.required<ElementRef<HTMLElement>>('main');
  private readonly sidenav = viewChild.required(MatSidenav);

  protected readonly me = this.auth.me;
  protected readonly narrow = toSignal(
    inject(BreakpointObserver).observe('(max-width: 959.98px)').pipe(map((s) => s.matches)),
    { initialValue: false },
  );
  protected readonly groups = computed(() => {
    const items = navItemsFor(this.auth.roles());
    const groups: { name: string; items: typeof items }[] = [];
    for (const item of items) {
      const last = groups.at(-1);
      if (last?.name === item.group) last.items.push(item);
      else groups.push({ name: item.group, items: [item] });
    }
    return groups;
  });
  protected readonly roleLabels = computed(() => this.auth.roles().map((r) => ROLE_LABELS[r]));
  protected readonly initials = computed(() =>
    (this.me()?.name ?? '?').split(/\s+/).filter(Boolean).slice(0, 2).map((p) => p[0]!.toUpperCase()).join(''),
  );
  protected readonly office = computed(() => this.serverInfo.info()?.office ?? null);

  constructor() {
    this.serverInfo.ensureLoaded();
    this.router.events
      .pipe(filter((e): e is NavigationEnd => e instanceof NavigationEnd), takeUntilDestroyed())
      .subscribe(() => this.afterNavigation());
  }

  /** Signs out and returns to the sign-in page. */
  protected signOut(): Promise<void> {
    return this.auth.signOut();
  }

  /** Closes the overlay navigation after a pick on narrow screens. */
  protected closeNavIfNarrow(): void {
    if (this.narrow()) void this.sidenav().close();
  }

  // Moves focus to the new page and names it, so keyboard and screen-reader users know where they are.
  private afterNavigation(): void {
    this.closeNavIfNarrow();
    setTimeout(() => {
      const main = this.main().nativeElement;
      const heading = main.querySelector<HTMLElement>('h1');
      (heading ?? main).focus({ preventScroll: false });
      void this.announcer.announce(document.title.replace(/ · Assayer$/, ''), 'polite');
    });
  }
}
