import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Subject, catchError, map, of, switchMap } from 'rxjs';
import type { AuditEntry, Page } from '../../../shared/api/types';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { EmptyState } from '../page-state/empty-state';
import { LoadError } from '../page-state/load-error';
import { AdminService, AuditQuery } from './admin-service';

type AuditResult = { page: Page<AuditEntry> } | { problem: ApiProblem };

/** Entity kinds the log records, offered as suggestions in the filter. */
export const AUDIT_ENTITY_TYPES = ['user', 'request', 'dataset', 'rerun', 'assignment', 'decision', 'letter', 'role-mapping', 'session'];

/** The append-only audit log, filtered by actor, action, entity and date range, newest first. */
@Component({
  selector: 'as-audit-log-page',
  imports: [
    DatePipe, ReactiveFormsModule, MatTableModule, MatPaginatorModule, MatProgressBarModule, MatFormFieldModule,
    MatInputModule, MatIconModule, MatButtonModule, EmptyState, LoadError,
  ],
  templateUrl: './audit-log-page.html',
  styleUrl: './audit-log-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditLogPage implements OnInit {
  private readonly admin = inject(AdminService);
  private readonly queries = new Subject<AuditQuery>();

  protected readonly entityTypes = AUDIT_ENTITY_TYPES;
  protected readonly columns = ['at', 'actor', 'action', 'entity', 'details'];
  protected readonly filters = inject(FormBuilder).nonNullable.group({
    actor: [''], action: [''], entityType: [''], from: [''], to: [''],
  });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(50);
  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly result = signal<Page<AuditEntry> | null>(null);
  protected readonly rows = computed(() =>
    (this.result()?.items ?? []).map((e) => ({ ...e, detailText: describeDetails(e.details) })),
  );
  protected readonly rangeError = signal('');

  constructor() {
    this.queries
      .pipe(
        switchMap((q) =>
          this.admin.audit(q).pipe(
            map((page): AuditResult => ({ page })),
            catchError((err: unknown) => of<AuditResult>({ problem: toApiProblem(err) })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((res) => {
        this.loading.set(false);
        if ('problem' in res) this.problem.set(res.problem);
        else this.result.set(res.page);
      });
  }

  ngOnInit(): void {
    this.load();
  }

  /** Applies the filter form from the first page. */
  applyFilters(): void {
    const { from, to } = this.filters.getRawValue();
    if (from && to && from > to) {
      this.rangeError.set('The "from" date is after the "to" date.');
      return;
    }
    this.rangeError.set('');
    this.pageIndex.set(0);
    this.load();
  }

  /** Empties every filter. */
  clearFilters(): void {
    this.filters.reset();
    this.applyFilters();
  }

  /** Moves to another page. */
  turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageSize !== this.pageSize() ? 0 : event.pageIndex);
    this.pageSize.set(event.pageSize);
    this.load();
  }

  /** Fetches the current page with the applied filters. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    const f = this.filters.getRawValue();
    this.queries.next({
      actor: f.actor.trim(), action: f.action.trim(), entityType: f.entityType.trim(), from: f.from, to: f.to,
      page: this.pageIndex(), pageSize: this.pageSize(),
    });
  }
}

// Shows details as "key: value" pairs; nested values stay as compact JSON.
function describeDetails(details: Record<string, unknown> | null | undefined): string {
  if (!details) return '';
  return Object.entries(details)
    .map(([k, v]) => `${k}: ${typeof v === 'string' ? v : JSON.stringify(v)}`)
    .join(' · ');
}
