import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatChipListboxChange, MatChipsModule } from '@angular/material/chips';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { DESIGN_KINDS } from '../../../shared/api/types';
import { DESIGN_KIND_LABELS } from '../../../shared/review/plan-mapping';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { LoadError } from '../page-state/load-error';
import { WorkloadService } from './workload-service';

/** A reviewer declares which designs they review; the office head's suggestions favour a match. */
@Component({
  selector: 'as-my-expertise-page',
  imports: [MatButtonModule, MatChipsModule, MatIconModule, MatProgressBarModule, LoadError],
  template: `
    <h1 class="as-page-title" tabindex="-1">My expertise</h1>
    <p class="as-page-lede">Pick the designs you are comfortable reviewing. When the office head assigns a request, reviewers
      whose expertise matches its design are suggested first. Nobody is blocked by this list.</p>
    <div class="bar-slot">@if (loading() || saving()) { <mat-progress-bar mode="indeterminate" aria-label="Working" /> }</div>
    @if (problem(); as p) {
      <as-load-error heading="Could not load your expertise" [message]="p.message" (retry)="load()" />
    } @else if (!loading()) {
      @if (unreadable()) {
        <p class="warn" role="note"><mat-icon aria-hidden="true">warning</mat-icon>Your saved list could not be read,
          so nothing is pre-selected. Saving replaces whatever was saved before.</p>
      }
      <section class="as-panel box">
        <h2 id="kinds-label">Designs I review</h2>
        <mat-chip-listbox multiple aria-labelledby="kinds-label" [value]="selected()" (change)="pick($event)">
          @for (k of kinds; track k.value) {
            <mat-chip-option [value]="k.value">{{ k.label }}</mat-chip-option>
          }
          @for (x of others(); track x) {
            <mat-chip-option [value]="x">{{ x }}</mat-chip-option>
          }
        </mat-chip-listbox>
        <p class="muted">{{ selected().length === 0 ? 'None selected.' : selected().length + ' selected.' }}
          @if (dirty()) { <strong>Not saved yet.</strong> }</p>
        @if (saveProblem(); as p) { <p class="error" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ p }}</p> }
        @if (saved()) { <p class="ok" role="status"><mat-icon aria-hidden="true">check_circle</mat-icon>Saved.</p> }
        <button mat-flat-button type="button" (click)="save()" [disabled]="saving() || !dirty()">Save my expertise</button>
      </section>
    }
  `,
  styles: `
    :host { display: block; max-width: 760px; }
    .bar-slot { height: 4px; margin-bottom: 8px; }
    .box { padding: 16px 20px; }
    h2 { font: var(--mat-sys-title-medium); margin: 0 0 10px; }
    .muted { color: var(--mat-sys-on-surface-variant); }
    .error, .ok { display: flex; gap: 6px; align-items: center; font-weight: 500; }
    .error { color: #8c1d18; }
    .warn { display: flex; gap: 8px; align-items: center; padding: 10px 14px; border-radius: 10px; background: #fbecd0; color: #6b4507; }
    .ok { color: var(--as-state-decided-fg); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MyExpertisePage implements OnInit {
  private readonly service = inject(WorkloadService);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly kinds = DESIGN_KINDS.map((value) => ({ value: value as string, label: DESIGN_KIND_LABELS[value] }));
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  protected readonly saved = signal(false);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly saveProblem = signal<string | null>(null);
  protected readonly selected = signal<string[]>([]);
  /** True when the saved list could not be read (the server has no read route). */
  protected readonly unreadable = signal(false);
  private readonly stored = signal<string[]>([]);
  /** Values saved earlier that are not design kinds (kept so saving does not drop them). */
  protected readonly others = computed(() => this.stored().filter((x) => !(DESIGN_KINDS as readonly string[]).includes(x)));
  protected readonly dirty = computed(() => [...this.selected()].sort().join('|') !== [...this.stored()].sort().join('|'));

  ngOnInit(): void {
    this.load();
  }

  /** Reads the saved list. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.service.myExpertise().pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: ({ expertise }) => {
        this.loading.set(false);
        this.stored.set(expertise);
        this.selected.set(expertise);
      },
      error: (err: unknown) => {
        this.loading.set(false);
        const p = toApiProblem(err);
        // Servers without the read route still accept the save; say that saving replaces the list.
        if (p.status === 404 || p.status === 405) this.unreadable.set(true);
        else this.problem.set(p);
      },
    });
  }

  /** Follows the chip selection. */
  protected pick(change: MatChipListboxChange): void {
    this.selected.set([...((change.value as string[] | null) ?? [])]);
    this.saved.set(false);
  }

  /** Saves the selection (PATCH /api/me/expertise). */
  save(): void {
    const list = this.selected();
    this.saving.set(true);
    this.saveProblem.set(null);
    this.service.saveMyExpertise(list).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (res) => {
        this.saving.set(false);
        const now = res?.expertise ?? list;
        this.stored.set(now);
        this.selected.set(now);
        this.saved.set(true);
        void this.announcer.announce('Your expertise is saved.', 'polite');
      },
      error: (err: unknown) => {
        this.saving.set(false);
        this.saveProblem.set(toApiProblem(err).message);
      },
    });
  }
}
