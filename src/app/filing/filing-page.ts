import { LiveAnnouncer } from '@angular/cdk/a11y';
import { STEPPER_GLOBAL_OPTIONS } from '@angular/cdk/stepper';
import { Location } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, OnInit, computed, inject, input, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatStepper, MatStepperModule } from '@angular/material/stepper';
import { Title } from '@angular/platform-browser';
import { Router, RouterLink } from '@angular/router';
import { catchError, firstValueFrom, forkJoin, of } from 'rxjs';
import type { DepartmentRef } from '../../../shared/api/types';
import type { DatasetPreview } from '../../../shared/api/workflow';
import { planProblems } from '../../../shared/review/plan-mapping';
import { toApiProblem } from '../api-client/api-error';
import { LoadError } from '../page-state/load-error';
import { currentDataset } from './current-dataset';
import { DataStep } from './data-step';
import { DesignStep } from './design-step';
import { DraftAutosave } from './draft-autosave';
import { FILING_STEPS, firstProblemStep, placeFieldProblems, stepOfField } from './field-problems';
import { fieldsFromForm, fillForm, planFromForm, type DraftDetail } from './filing-draft';
import { createFilingForm } from './filing-form';
import { FilingService } from './filing-service';
import { FilingSummary } from './filing-summary';
import { PurposeStep } from './purpose-step';
import { ReportedStep } from './reported-step';
import { RevisionChanges } from './revision-changes';
import { SaveStatusLine } from './save-status';
import { localProblems } from './submit-check';

const STEP_LABELS = ['Purpose', 'Design', 'Data', 'Reported results', 'Review and submit'];

/** The filing form: five steps (not locked in order), autosaved as a draft, checked in full on submit. */
@Component({
  selector: 'as-filing-page',
  imports: [FormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatStepperModule,
    LoadError, PurposeStep, DesignStep, DataStep, ReportedStep, FilingSummary, RevisionChanges, SaveStatusLine],
  providers: [{ provide: STEPPER_GLOBAL_OPTIONS, useValue: { showError: true, displayDefaultIndicatorType: false } }],
  templateUrl: './filing-page.html',
  styleUrl: './filing-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FilingPage implements OnInit {
  private readonly api = inject(FilingService);
  private readonly router = inject(Router);
  private readonly location = inject(Location);
  private readonly title = inject(Title);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly destroyRef = inject(DestroyRef);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly stepper = viewChild(MatStepper);

  /** Route parameter; absent on /requests/new. */
  readonly id = input<string | undefined>(undefined);

  protected readonly stepLabels = STEP_LABELS;
  protected readonly form = createFilingForm();
  protected readonly loading = signal(true);
  protected readonly loadProblem = signal<string | null>(null);
  protected readonly request = signal<DraftDetail | null>(null);
  protected readonly departments = signal<DepartmentRef[]>([]);
  protected readonly departmentsFailed = signal(false);
  protected readonly datasets = signal<DatasetPreview[]>([]);
  protected readonly serverProblems = signal<Record<string, string>>({});
  protected readonly submitting = signal(false);
  protected readonly submitMessage = signal('');
  protected readonly revisionNote = signal('');
  /** What the person had typed before reloading after a conflict, to copy back. */
  protected readonly keptText = signal<{ label: string; text: string }[]>([]);
  private alpha = 0.05;

  protected readonly autosave = new DraftAutosave(this.api, () => fieldsFromForm(this.form), (d, created) => this.saved(d, created));
  private readonly formValue = toSignal(this.form.valueChanges, { initialValue: null });
  protected readonly current = computed(() => currentDataset(this.datasets()));
  protected readonly columns = computed(() => this.current()?.columns ?? []);
  /** What the chosen design still needs, shown beside the fields as the person works. */
  protected readonly planIssues = computed(() => {
    this.formValue();
    this.request();
    return planProblems(planFromForm(this.form));
  });
  /** Plan check, autosave field messages and the last submit's problems, by API key. */
  protected readonly problems = computed(() => ({ ...this.planIssues(), ...this.autosave.fieldErrors(), ...this.serverProblems() }));
  /** Steps with a problem from the last submit check or save (plan-check notes alone do not mark a step). */
  protected readonly stepsWithProblems = computed(() => new Set(Object.keys({ ...this.autosave.fieldErrors(), ...this.serverProblems() }).map(stepOfField)));
  protected readonly summaryFields = computed(() => {
    this.formValue();
    this.request();
    return fieldsFromForm(this.form);
  });
  /** Problems from the last submit that no field shows (they are listed on the review step). */
  protected readonly otherProblems = computed(() => Object.entries(this.serverProblems()).filter(([k]) => stepOfField(k) === 4).map(([, v]) => v));
  /** Number of problems from the last submit attempt, for the banner above the steps. */
  protected readonly problemCount = computed(() => Object.keys(this.serverProblems()).length);
  /** Names of the steps holding those problems, in order. */
  protected readonly problemSteps = computed(() => {
    const steps = [...new Set(Object.keys(this.serverProblems()).map(stepOfField))].sort();
    return steps.map((i) => `"${STEP_LABELS[i]}"`).join(steps.length > 2 ? ', ' : ' and ');
  });
  protected readonly blocked = computed(() => this.current()?.blocked ?? false);
  protected readonly submitBlockReason = computed(() => {
    if (this.autosave.status() === 'conflict') return 'The draft was changed elsewhere; reload it before submitting.';
    if (!this.autosave.requestId()) return 'Give the request a title first so the draft is saved.';
    if (!this.current()) return 'Upload the data file on the Data step first.';
    if (this.blocked()) return 'Some columns of the data look like personal identifiers. On the Data step, upload a file without them or say why each is needed.';
    return '';
  });
  protected readonly isRevision = computed(() => this.request()?.state === 'revision-requested');

  constructor() {
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      if (!this.loading()) this.autosave.schedule();
    });
    this.destroyRef.onDestroy(() => this.autosave.dispose());
  }

  ngOnInit(): void {
    this.load();
  }

  /** Loads departments, the office default alpha and, when editing, the request and its datasets. */
  load(): void {
    this.loading.set(true);
    this.loadProblem.set(null);
    const id = this.id();
    forkJoin({
      departments: this.api.departments().pipe(catchError(() => { this.departmentsFailed.set(true); return of([] as DepartmentRef[]); })),
      settings: this.api.officeSettings().pipe(catchError(() => of(null))),
      request: id ? this.api.load(id) : of(null),
      datasets: id ? this.api.datasets(id).pipe(catchError(() => of([] as DatasetPreview[]))) : of([] as DatasetPreview[]),
    }).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: ({ departments, settings, request, datasets }) => {
        this.departments.set(departments);
        this.alpha = settings?.defaultAlpha ?? 0.05;
        this.datasets.set(datasets);
        if (request) {
          fillForm(this.form, request as DraftDetail, departments, this.alpha);
          this.autosave.startFrom(request, fieldsFromForm(this.form));
          this.request.set(request as DraftDetail);
          // A request that is filed, decided or not the viewer's own is shown read-only here.
          if (!request.can.edit) this.form.disable({ emitEvent: false });
          this.title.setTitle(`Edit ${request.reference} · Assayer`);
        } else {
          this.form.controls.design.controls.alpha.setValue(this.alpha, { emitEvent: false });
          this.title.setTitle('New review request · Assayer');
        }
        this.loading.set(false);
      },
      error: (err: unknown) => {
        this.loadProblem.set(toApiProblem(err).message);
        this.loading.set(false);
      },
    });
  }

  /** After each save: keep the request, and give a new draft its own address. */
  private saved(d: DraftDetail, created: boolean): void {
    this.request.set(d);
    if (created) {
      this.location.replaceState(`/requests/${d.id}/edit`);
      this.title.setTitle(`Edit ${d.reference} · Assayer`);
      void this.announcer.announce(`Draft ${d.reference} created and saved.`, 'polite');
      if (this.form.controls.purpose.controls.departmentId.value === null && d.department) {
        const dept = this.departments().find((x) => x.name === d.department);
        if (dept) this.form.controls.purpose.controls.departmentId.setValue(dept.id, { emitEvent: false });
      }
    }
  }

  /** After a conflict: keep the typed text for copying, then load the saved version. */
  protected reloadAfterConflict(): void {
    const f = fieldsFromForm(this.form);
    const kept = [
      { label: 'Title', text: f.title }, { label: 'Purpose', text: f.purpose }, { label: 'Decision informed', text: f.decisionInformed },
      { label: 'Audience', text: f.audience }, { label: 'Sampling and data collection', text: f.samplingNotes },
      ...f.reported.map((r, i) => ({ label: `Reported result ${i + 1}`, text: r.term ? `${r.text}  [term: ${r.term}]` : r.text })),
    ].filter((k) => k.text.trim() !== '');
    this.keptText.set(kept);
    const id = this.autosave.requestId();
    if (!id) return;
    this.api.load(id).subscribe({
      next: (r) => {
        this.loading.set(true);
        fillForm(this.form, r as DraftDetail, this.departments(), this.alpha);
        this.autosave.startFrom(r, fieldsFromForm(this.form));
        this.request.set(r as DraftDetail);
        this.loading.set(false);
        void this.announcer.announce('The saved version is loaded. Your earlier text is listed above the form to copy.', 'polite');
      },
      error: (err: unknown) => this.submitMessage.set(`Could not reload the draft. ${toApiProblem(err).message}`),
    });
  }

  /** Whether a step shows the error mark. */
  protected stepHasProblem(i: number): boolean {
    return this.stepsWithProblems().has(i);
  }

  /** Saves, checks locally, then asks the server to check the plan against the data and file the request. */
  protected async submitRequest(): Promise<void> {
    this.submitMessage.set('');
    this.serverProblems.set({});
    this.submitting.set(true);
    try {
      const saved = await this.autosave.flush();
      const id = this.autosave.requestId();
      if (!saved || !id) {
        this.submitMessage.set(`The draft could not be saved, so it was not submitted. ${this.autosave.message()}`);
        const fe = this.autosave.fieldErrors();
        if (Object.keys(fe).length) this.showProblems(fe);
        return;
      }
      const local = localProblems(fieldsFromForm(this.form), this.current());
      if (Object.keys(local).length) {
        this.showProblems(local);
        return;
      }
      const note = this.revisionNote().trim();
      const r = await firstValueFrom(this.api.submit(id, this.autosave.version(), note || undefined));
      this.autosave.dispose();
      void this.router.navigate(['/requests', r.id ?? id], { queryParams: { submitted: this.isRevision() ? 'revision' : 'filed' } });
    } catch (err) {
      const p = toApiProblem(err);
      if (Object.keys(p.fields).length) this.showProblems(p.fields, p.message);
      else this.submitMessage.set(p.status === 409 ? 'Someone changed this request since you opened it. Reload it before submitting; your text stays on screen.' : `Not submitted. ${p.message}`);
    } finally {
      this.submitting.set(false);
    }
  }

  /** Shows problems beside their fields, opens the first step with one and moves focus to it. */
  private showProblems(problems: Record<string, string>, headline = ''): void {
    this.serverProblems.set(problems);
    placeFieldProblems(this.form, problems);
    const n = Object.keys(problems).length;
    const step = firstProblemStep(problems);
    this.submitMessage.set(headline || `Not submitted yet: ${n === 1 ? 'one thing needs' : `${n} things need`} your attention. Each is shown next to its field.`);
    void this.announcer.announce(`Not submitted. ${n} ${n === 1 ? 'problem' : 'problems'}; moving to the ${STEP_LABELS[step] ?? 'first'} step.`, 'assertive');
    const stepper = this.stepper();
    if (stepper && step >= 0) stepper.selectedIndex = step;
    const first = Object.keys(problems).find((k) => stepOfField(k) === step) ?? '';
    setTimeout(() => this.focusProblem(first), 350);
  }

  /** Focuses the field a problem key names, or the first invalid field of the open step. */
  private focusProblem(key: string): void {
    const root = this.host.nativeElement;
    // The open step's panel is the one tab panel that is not inert.
    const pane = root.querySelector<HTMLElement>('[role=tabpanel]:not([inert])') ?? root;
    const focusable = 'input:not([type=file]):not([readonly]), textarea, mat-select, [role=combobox], button';
    const byKey = key.startsWith('reported.') ? null : pane.querySelector<HTMLElement>(`[data-field="${key.replace(/["\\]/g, '\\$&')}"]`);
    const target = byKey?.querySelector<HTMLElement>(focusable) ?? byKey
      ?? pane.querySelector<HTMLElement>('.mat-mdc-form-field-invalid input, .mat-mdc-form-field-invalid textarea, .mat-mdc-form-field-invalid mat-select, [role=note], [role=alert]');
    if (target) {
      if (!target.hasAttribute('tabindex') && !/^(INPUT|TEXTAREA|BUTTON|SELECT)$/.test(target.tagName) && target.getAttribute('role') !== 'combobox') target.setAttribute('tabindex', '-1');
      target.focus();
    }
  }

  /** Steps' keys, for tests and the template. */
  protected readonly steps = FILING_STEPS;
}
