import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxChange, MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Subject, catchError, debounceTime, distinctUntilChanged, map, of, switchMap } from 'rxjs';
import { ROLES, type Page, type Role, type UserAdminRow } from '../../../shared/api/types';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { AuthService } from '../auth/auth-service';
import { EmptyState } from '../page-state/empty-state';
import { LoadError } from '../page-state/load-error';
import { ROLE_LABELS } from '../shell/role-labels';
import { AdminService } from './admin-service';
import { CreateAccountDialog } from './create-account-dialog';

type UsersResult = { page: Page<UserAdminRow> } | { problem: ApiProblem };

/** People and roles: every account with a switch per role, and local account creation. */
@Component({
  selector: 'as-people-page',
  imports: [
    DatePipe, ReactiveFormsModule, MatTableModule, MatCheckboxModule, MatPaginatorModule, MatProgressBarModule,
    MatFormFieldModule, MatInputModule, MatIconModule, MatButtonModule, EmptyState, LoadError,
  ],
  templateUrl: './people-page.html',
  styleUrl: './people-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeoplePage implements OnInit {
  private readonly admin = inject(AdminService);
  private readonly auth = inject(AuthService);
  private readonly dialog = inject(MatDialog);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly queries = new Subject<{ q: string; page: number; pageSize: number }>();

  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly columns = ['person', 'department', 'signIn', ...ROLES.map((r) => `role-${r}`), 'lastSignIn'];
  protected readonly search = new FormControl('', { nonNullable: true });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly result = signal<Page<UserAdminRow> | null>(null);
  protected readonly rows = computed(() => this.result()?.items ?? []);
  /** Ids of people whose roles are being saved. */
  protected readonly saving = signal<ReadonlySet<string>>(new Set());
  /** Set when a save lost a race with someone else's change. */
  protected readonly conflict = signal<string>('');
  /** Last save outcome, read out politely. */
  protected readonly status = signal('');
  private readonly myId = computed(() => this.auth.me()?.id);

  constructor() {
    this.queries
      .pipe(
        switchMap((q) =>
          this.admin.users(q.q, q.page, q.pageSize).pipe(
            map((page): UsersResult => ({ page })),
            catchError((err: unknown) => of<UsersResult>({ problem: toApiProblem(err) })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((res) => {
        this.loading.set(false);
        if ('problem' in res) this.problem.set(res.problem);
        else this.result.set(res.page);
      });
    this.search.valueChanges
      .pipe(debounceTime(350), map((v) => v.trim()), distinctUntilChanged(), takeUntilDestroyed())
      .subscribe(() => {
        this.pageIndex.set(0);
        this.load();
      });
  }

  ngOnInit(): void {
    this.load();
  }

  /** Fetches the current page of people. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.conflict.set('');
    this.queries.next({ q: this.search.value, page: this.pageIndex(), pageSize: this.pageSize() });
  }

  /** Moves to another page. */
  turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageSize !== this.pageSize() ? 0 : event.pageIndex);
    this.pageSize.set(event.pageSize);
    this.load();
  }

  /** Whether the admin may not remove this role here (their own admin role: avoids locking the office out). */
  protected isLocked(user: UserAdminRow, role: Role): boolean {
    return role === 'admin' && user.id === this.myId() && user.roles.includes('admin');
  }

  /** Grants or removes one role, sending the version read so a concurrent change is caught. */
  toggleRole(user: UserAdminRow, role: Role, change: MatCheckboxChange | { checked: boolean }): void {
    const roles = change.checked ? ROLES.filter((r) => r === role || user.roles.includes(r)) : user.roles.filter((r) => r !== role);
    this.setSaving(user.id, true);
    this.status.set('');
    this.admin.setRoles(user, roles).subscribe({
      next: (updated) => {
        this.setSaving(user.id, false);
        this.replaceRow(updated);
        const verb = change.checked ? 'now holds' : 'no longer holds';
        this.status.set(`${updated.name} ${verb} the ${ROLE_LABELS[role]} role.`);
      },
      error: (err: unknown) => {
        this.setSaving(user.id, false);
        // Put the checkbox back: the row still shows the last roles the server confirmed.
        this.replaceRow({ ...user });
        const p = toApiProblem(err);
        if (p.status === 409) {
          this.conflict.set(`Someone else changed ${user.name}'s account after this page loaded, so your change was not saved. Reload to see the current roles, then try again.`);
        } else {
          this.status.set(`Could not change ${user.name}'s roles: ${p.message}`);
        }
        void this.announcer.announce(this.conflict() || this.status(), 'assertive');
      },
    });
  }

  /** Opens the dialog for a new local account and adds the result to the list. */
  openCreateAccount(): void {
    this.dialog
      .open(CreateAccountDialog, { width: '520px', maxWidth: '95vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((created?: UserAdminRow) => {
        if (!created) return;
        this.status.set(`Local account created for ${created.name}.`);
        this.load();
      });
  }

  private replaceRow(row: UserAdminRow): void {
    const page = this.result();
    if (!page) return;
    this.result.set({ ...page, items: page.items.map((u) => (u.id === row.id ? row : u)) });
  }

  private setSaving(id: string, on: boolean): void {
    const next = new Set(this.saving());
    if (on) next.add(id);
    else next.delete(id);
    this.saving.set(next);
  }
}
