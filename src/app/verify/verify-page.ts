import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { Observable } from 'rxjs';
import type { VerificationView } from '../../../shared/api/workflow';
import { toApiProblem } from '../api-client/api-error';
import { DECISION_LABELS } from '../review/review-labels';
import { BrandMark } from '../shell/brand-mark';
import { VerifyService } from './verify-service';
import { OUTCOMES, SCOPE_CAUTION, outcomeTitle } from './verify-texts';

/** Largest upload the page sends; the server enforces its own limit too. */
export const MAX_PDF_BYTES = 20 * 1024 * 1024;

/**
 * The public verification page: anyone holding a letter enters its code or drops the PDF
 * and reads, in plain words, whether the letter is genuine, current, superseded or altered.
 * Works signed out: it sits outside the signed-in shell and draws its own small header.
 */
@Component({
  selector: 'as-verify-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, BrandMark],
  templateUrl: './verify-page.html',
  styleUrl: './verify-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerifyPage {
  private readonly destroyRef = inject(DestroyRef);
  private readonly router = inject(Router);
  private readonly verify = inject(VerifyService);

  /** Route parameter of /verify/:code (absent on /verify). */
  readonly code = input<string | undefined>(undefined);

  protected readonly outcomes = OUTCOMES;
  protected readonly outcomeTitle = outcomeTitle;
  protected readonly decisionLabels = DECISION_LABELS;
  protected readonly caution = SCOPE_CAUTION;
  protected readonly typed = signal('');
  protected readonly busy = signal(false);
  protected readonly result = signal<VerificationView | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly dragging = signal(false);
  protected readonly fileName = signal<string | null>(null);
  /** What the shown result is about (a code or a file name), read out with the result by the live region. */
  protected readonly checked = signal('');

  constructor() {
    // The router reuses this page between /verify/A and /verify/B, so follow the input rather than init.
    effect(() => {
      const c = this.code()?.trim();
      if (!c) return;
      untracked(() => {
        this.typed.set(c);
        this.fileName.set(null);
        this.run(this.verify.byCode(c), `code ${c}`);
      });
    });
  }

  /** Checks the typed code by putting it in the address, so the result can be bookmarked and shared. */
  protected checkCode(): void {
    const c = this.typed().trim();
    if (!c) {
      this.result.set(null);
      this.error.set('Enter the verification code printed on the letter, or upload the PDF.');
      return;
    }
    if (c === this.code()?.trim()) this.run(this.verify.byCode(c), `code ${c}`);
    else void this.router.navigate(['/verify', c]);
  }

  /** File picked with the button. */
  protected picked(input: HTMLInputElement): void {
    const f = input.files?.[0];
    if (f) this.checkFile(f);
    input.value = '';
  }

  /** File dropped on the zone. */
  protected dropped(ev: DragEvent): void {
    ev.preventDefault();
    this.dragging.set(false);
    const f = ev.dataTransfer?.files?.[0];
    if (f) this.checkFile(f);
  }

  /** Keeps the browser from opening the file while it is dragged over the zone. */
  protected over(ev: DragEvent): void {
    ev.preventDefault();
    this.dragging.set(true);
  }

  private checkFile(f: File): void {
    this.fileName.set(f.name);
    if (f.size > MAX_PDF_BYTES) {
      this.result.set(null);
      this.error.set(`${f.name} is ${(f.size / 1048576).toFixed(1)} MB; letters are far smaller. Upload the letter’s PDF (at most 20 MB).`);
      return;
    }
    this.run(this.verify.byFile(f), f.name);
  }

  private run(call: Observable<VerificationView>, what: string): void {
    this.busy.set(true);
    this.error.set(null);
    this.result.set(null);
    call.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (v) => {
        this.busy.set(false);
        this.result.set(v);
        this.checked.set(what);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const p = toApiProblem(err);
        this.error.set(p.status === 413 ? 'The file is too large to be a letter from the office. Upload the letter’s PDF.' : p.message);
      },
    });
  }
}
