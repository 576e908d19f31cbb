import { ChangeDetectionStrategy, Component, input, signal } from '@angular/core';
import { FormsModule, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { parseReported } from '../../../shared/stats/apa/parse';
import { controlMessage } from './field-problems';
import { reportedForm, type FilingForm, type ReportedForm } from './filing-form';
import { composeReported, describeParsed, emptyParts, type ReportedParts } from './reported-text';

/** Live reading of one line: what the parser understood, or why it could not. */
export interface LineReading {
  ok: boolean;
  text: string;
}

/** Step 4: the results the submitter intends to publish, typed or built field by field, with live parse feedback. */
@Component({
  selector: 'as-reported-step',
  imports: [ReactiveFormsModule, FormsModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './reported-step.html',
  styleUrl: './reported-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportedStep {
  /** The reported lines of the filing form. */
  readonly lines = input.required<FilingForm['controls']['reported']>();
  /** Problems keyed like "reported.0" (server). */
  readonly problems = input<Record<string, string>>({});

  /** Lines (by control) being built field by field, with their parts. */
  protected readonly building = signal(new Map<ReportedForm, ReportedParts>());
  protected readonly message = controlMessage;

  /** Parses a line as typed; empty lines say nothing. */
  protected reading(line: ReportedForm): LineReading | null {
    const text = line.controls.text.value;
    if (text.trim() === '') return null;
    const r = parseReported(text);
    return r.ok ? { ok: true, text: describeParsed(r.report) } : { ok: false, text: `Could not read this: ${r.message}.` };
  }

  /** Adds an empty line and keeps focus flow natural (the new field is last). */
  protected addLine(): void {
    this.lines().push(reportedForm());
  }

  /** Removes a line. */
  protected removeLine(i: number): void {
    const line = this.lines().at(i);
    this.lines().removeAt(i);
    this.setMode(line, 'type');
  }

  /** Switches a line between typing and building. */
  protected setMode(line: ReportedForm, mode: 'type' | 'build'): void {
    const next = new Map(this.building());
    if (mode === 'build') next.set(line, next.get(line) ?? emptyParts());
    else next.delete(line);
    this.building.set(next);
  }

  /** Updates one builder field and writes the composed string into the line. */
  protected setPart(line: ReportedForm, key: keyof ReportedParts, value: string): void {
    const parts = { ...(this.building().get(line) ?? emptyParts()), [key]: value } as ReportedParts;
    const next = new Map(this.building());
    next.set(line, parts);
    this.building.set(next);
    line.controls.text.setValue(composeReported(parts));
    line.controls.text.markAsDirty();
  }

  /** The server's or validation message for a line, numbered among the non-empty lines as saved. */
  protected lineProblem(line: ReportedForm): string {
    const own = this.message(line.controls.text);
    if (own) return own;
    const filled = this.lines().controls.filter((l) => l.controls.text.value.trim() !== '');
    const n = filled.indexOf(line);
    return n >= 0 ? this.problems()[`reported.${n}`] ?? '' : '';
  }
}
