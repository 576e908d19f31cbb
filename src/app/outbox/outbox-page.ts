import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { DomSanitizer, SafeHtml } from '@angular/platform-browser';
import type { OutboxMail } from '../../../shared/api/workflow';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { EmptyState } from '../page-state/empty-state';
import { LoadError } from '../page-state/load-error';
import { OutboxService } from './outbox-service';

/** Development-only page: the e-mails Assayer sent, as caught by the local mail catcher. */
@Component({
  selector: 'as-outbox-page',
  imports: [DatePipe, MatButtonModule, MatButtonToggleModule, MatIconModule, MatProgressBarModule, EmptyState, LoadError],
  templateUrl: './outbox-page.html',
  styleUrl: './outbox-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutboxPage implements OnInit {
  private readonly service = inject(OutboxService);
  private readonly sanitizer = inject(DomSanitizer);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  /** True when the server says mail does not go to the local catcher (404). */
  protected readonly notLocal = signal(false);
  protected readonly mails = signal<OutboxMail[]>([]);
  protected readonly selectedId = signal<string | null>(null);
  protected readonly view = signal<'text' | 'html'>('text');
  protected readonly selected = computed(() => this.mails().find((m) => m.id === this.selectedId()) ?? null);
  /**
   * The HTML part for the preview frame. It is shown only inside an iframe with an empty sandbox
   * (no scripts, no forms, no same-origin access), so Angular's own HTML sanitising is not needed there.
   */
  protected readonly htmlDoc = computed<SafeHtml | null>(() => {
    const html = this.selected()?.html;
    return html ? this.sanitizer.bypassSecurityTrustHtml(html) : null;
  });

  ngOnInit(): void {
    this.load();
  }

  /** Loads the caught mails, newest first. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.notLocal.set(false);
    this.service.list().pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (mails) => {
        this.loading.set(false);
        const sorted = [...mails].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
        this.mails.set(sorted);
        if (!sorted.some((m) => m.id === this.selectedId())) this.selectedId.set(sorted[0]?.id ?? null);
      },
      error: (err: unknown) => {
        this.loading.set(false);
        const p = toApiProblem(err);
        if (p.status === 404) this.notLocal.set(true);
        else this.problem.set(p);
      },
    });
  }

  /** Shows one mail. */
  protected show(mail: OutboxMail): void {
    this.selectedId.set(mail.id);
    if (!mail.html) this.view.set('text');
  }
}
