import { LiveAnnouncer } from '@angular/cdk/a11y';
import { BreakpointObserver } from '@angular/cdk/layout';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatChipListboxChange, MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { Subject, catchError, debounceTime, distinctUntilChanged, map, of, switchMap } from 'rxjs';
import { REQUEST_STATE_LABELS, type Page, type RequestState, type RequestSummary } from '../../../shared/api/types';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { EmptyState } from '../page-state/empty-state';
import { LoadError } from '../page-state/load-error';
import { RequestListQuery, RequestScope, RequestService } from './request-service';
import { SCOPE_TEXTS } from './scope-texts';
import { StateChip } from './state-chip';

type LoadResult = { page: Page<RequestSummary> } | { problem: ApiProblem };

// States after which a due date no longer matters.
const CLOSED: readonly RequestState[] = ['decided', 'withdrawn'];

/** A server-sorted, filtered and paged table of review requests, reused by all three request lists. */
@Component({
  selector: 'as-request-table',
  imports: [
    DatePipe, ReactiveFormsModule, RouterLink, MatTableModule, MatSortModule, MatPaginatorModule, MatChipsModule,
    MatFormFieldModule, MatInputModule, MatIconModule, MatButtonModule, MatProgressBarModule, StateChip, EmptyState, LoadError,
  ],
  templateUrl: './request-table.html',
  styleUrl: './request-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestTable implements OnInit {
  private readonly requests = inject(RequestService);
  private readonly router = inject(Router);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly queries = new Subject<RequestListQuery>();

  /** Which list to show. */
  readonly scope = input.required<RequestScope>();

  protected readonly texts = computed(() => SCOPE_TEXTS[this.scope()]);
  protected readonly stateOptions = computed(() =>
    this.texts().states.map((s) => ({ value: s, label: REQUEST_STATE_LABELS[s] })),
  );
  private readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 719.98px)').pipe(map((s) => s.matches)), {
    initialValue: false,
  });
  // Phones keep the columns needed to pick a request; the rest is on its detail page.
  protected readonly columns = computed(() =>
    this.narrow()
      ? ['reference', 'title', 'state', 'dueAt']
      : ['reference', 'title', 'state', 'department', 'person', 'filedAt', 'dueAt'],
  );
  protected readonly pageSizeOptions = [10, 25, 50];

  protected readonly search = new FormControl('', { nonNullable: true });
  protected readonly states = signal<RequestState[]>([]);
  protected readonly sort = signal<Sort>({ active: '', direction: '' });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);

  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly result = signal<Page<RequestSummary> | null>(null);
  protected readonly rows = computed(() => {
    const now = Date.now();
    return (this.result()?.items ?? []).map((r) => ({
      ...r,
      person: this.texts().person === 'reviewer' ? r.reviewer : r.submitter,
      overdue: !!r.dueAt && !CLOSED.includes(r.state) && Date.parse(r.dueAt) < now,
    }));
  });
  protected readonly total = computed(() => this.result()?.total ?? 0);
  protected readonly filtered = computed(() => this.states().length > 0 || this.appliedSearch() !== '');
  private readonly appliedSearch = signal('');

  constructor() {
    this.queries
      .pipe(
        switchMap((q) =>
          this.requests.list(q).pipe(
            map((page): LoadResult => ({ page })),
            catchError((err: unknown) => of<LoadResult>({ problem: toApiProblem(err) })),
          ),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((res) => this.receive(res));
    this.search.valueChanges
      .pipe(debounceTime(350), map((v) => v.trim()), distinctUntilChanged(), takeUntilDestroyed())
      .subscribe(() => this.applySearch());
  }

  ngOnInit(): void {
    const { sort } = this.texts();
    this.sort.set({ active: sort.active, direction: sort.direction });
    this.load();
  }

  /** Runs the text filter now (Enter key or after typing stops), back to the first page. */
  applySearch(): void {
    const q = this.search.value.trim();
    if (q === this.appliedSearch() && !this.problem()) return;
    this.appliedSearch.set(q);
    this.pageIndex.set(0);
    this.load();
  }

  /** Applies the state chips, back to the first page. */
  filterByStates(change: MatChipListboxChange): void {
    this.states.set([...((change.value as RequestState[] | null) ?? [])]);
    this.pageIndex.set(0);
    this.load();
  }

  /** Asks the server for a new sort order, back to the first page. */
  sortBy(sort: Sort): void {
    this.sort.set(sort);
    this.pageIndex.set(0);
    this.load();
  }

  /** Moves to another page or page size. */
  turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageSize !== this.pageSize() ? 0 : event.pageIndex);
    this.pageSize.set(event.pageSize);
    this.load();
  }

  /** Removes text and state filters. */
  clearFilters(): void {
    this.search.setValue('', { emitEvent: false });
    this.appliedSearch.set('');
    this.states.set([]);
    this.pageIndex.set(0);
    this.load();
  }

  /** Fetches the current page with the current query. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    const sort = this.sort();
    this.queries.next({
      scope: this.scope(),
      q: this.appliedSearch(),
      states: this.states(),
      sort: sort.active,
      dir: sort.direction,
      page: this.pageIndex(),
      pageSize: this.pageSize(),
    });
  }

  /** Opens a request's detail page (whole-row click for mouse users; the reference link serves keyboards). */
  protected openRequest(row: RequestSummary, event: MouseEvent): void {
    if ((event.target as HTMLElement).closest('a')) return;
    void this.router.navigate(['/requests', row.id]);
  }

  private receive(res: LoadResult): void {
    this.loading.set(false);
    if ('problem' in res) {
      this.problem.set(res.problem);
      void this.announcer.announce(`Could not load requests. ${res.problem.message}`, 'assertive');
      return;
    }
    this.result.set(res.page);
    const n = res.page.total;
    void this.announcer.announce(n === 1 ? '1 request' : `${n} requests`, 'polite');
  }
}
