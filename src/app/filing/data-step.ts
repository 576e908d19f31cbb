import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, input, model, signal, viewChild } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import type { DatasetPreview } from '../../../shared/api/workflow';
import { toApiProblem } from '../api-client/api-error';
import { ColumnField } from './column-field';
import { currentDataset } from './current-dataset';
import { DatasetPreviewTable } from './dataset-preview-table';
import { FilingService } from './filing-service';
import { factorForm, type FilingForm } from './filing-form';
import { IdentifierBlock } from './identifier-block';
import { DESIGN_USES } from './plan-texts';
import { ReshapeDialog, type ReshapeDialogData } from './reshape-dialog';

/** Largest file the form sends; the server enforces its own limit too. */
export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;

/** Step 3: upload the data, see what was read, map columns to the plan, clear identifier columns. */
@Component({
  selector: 'as-data-step',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatProgressBarModule, MatSelectModule, ColumnField, DatasetPreviewTable, IdentifierBlock],
  templateUrl: './data-step.html',
  styleUrl: './data-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DataStep {
  private readonly api = inject(FilingService);
  private readonly dialog = inject(MatDialog);

  /** The draft's id (null until the draft exists: uploads need it). */
  readonly requestId = input<string | null>(null);
  /** The design part of the filing form (for the column mapping). */
  readonly design = input.required<FilingForm['controls']['design']>();
  /** Problems keyed like "dataset" or "plan.outcome". */
  readonly problems = input<Record<string, string>>({});
  /** Datasets of the request, oldest first. */
  readonly datasets = model<DatasetPreview[]>([]);

  protected readonly current = computed(() => currentDataset(this.datasets()));
  protected readonly older = computed(() => this.datasets().filter((d) => d !== this.current()));
  protected readonly progress = signal<number | null>(null);
  protected readonly uploadError = signal('');
  protected readonly busy = signal(false);
  protected readonly identifierError = signal('');
  protected readonly notice = signal('');
  private readonly fileInput = viewChild<ElementRef<HTMLInputElement>>('file');
  /** Dataset to delete once a replacement upload succeeds ("upload a file without it"). */
  private replacing: string | null = null;

  protected uses() {
    const k = this.design().controls.designKind.value;
    return k ? DESIGN_USES[k] : null;
  }

  /** Opens the file picker; when replacing, the current file is removed after the new one is stored. */
  protected chooseFile(replace = false): void {
    this.replacing = replace ? this.current()?.id ?? null : null;
    this.fileInput()?.nativeElement.click();
  }

  /** Reads the picked file from the input and uploads it. */
  protected filePicked(event: Event): void {
    const el = event.target as HTMLInputElement;
    const file = el.files?.[0];
    el.value = '';
    if (file) this.upload(file);
  }

  /** Uploads a file with progress; the preview appears when the server has read it. */
  upload(file: File): void {
    const id = this.requestId();
    this.uploadError.set('');
    this.notice.set('');
    if (!id) {
      this.uploadError.set('Give the request a title on the Purpose step first: the draft is created then, and the file is attached to it.');
      return;
    }
    if (!/\.(csv|xlsx)$/i.test(file.name)) {
      this.uploadError.set(`"${file.name}" is not a CSV or XLSX file. Save the sheet as .csv or .xlsx and upload that.`);
      return;
    }
    if (file.size > MAX_UPLOAD_BYTES) {
      this.uploadError.set(`"${file.name}" is ${(file.size / 1048576).toFixed(1)} MB; the limit is ${MAX_UPLOAD_BYTES / 1048576} MB.`);
      return;
    }
    this.progress.set(0);
    this.api.upload(id, file).subscribe({
      next: (e) => {
        if (e.type === HttpEventType.UploadProgress) this.progress.set(e.total ? Math.round((100 * e.loaded) / e.total) : 0);
        if (e.type === HttpEventType.Response && e.body) this.uploaded(e.body);
      },
      error: (err: unknown) => {
        this.progress.set(null);
        this.replacing = null;
        this.uploadError.set(`The file was not stored. ${toApiProblem(err).message}`);
      },
    });
  }

  private uploaded(d: DatasetPreview): void {
    this.progress.set(null);
    this.datasets.update((list) => [...list, d]);
    const old = this.replacing;
    this.replacing = null;
    this.notice.set(`"${d.filename}" was read: ${d.rows} rows, ${d.columns.length} columns.`);
    if (old) void this.deleteDataset(old, true);
  }

  /** Removes a dataset from the draft. */
  async deleteDataset(datasetId: string, replaced = false): Promise<void> {
    const id = this.requestId();
    if (!id) return;
    this.busy.set(true);
    try {
      await firstValueFrom(this.api.deleteDataset(id, datasetId));
      this.datasets.update((list) => list.filter((d) => d.id !== datasetId));
      if (replaced) this.notice.set(`${this.notice()} The earlier file was removed.`);
    } catch (err) {
      this.uploadError.set(`Could not remove the earlier file. ${toApiProblem(err).message}`);
    } finally {
      this.busy.set(false);
    }
  }

  /** Records that a flagged column is needed, with the reason. */
  async confirmIdentifier(c: { column: string; reason: string }): Promise<void> {
    const id = this.requestId();
    const d = this.current();
    if (!id || !d) return;
    this.busy.set(true);
    this.identifierError.set('');
    const all = [...d.identifierConfirmations.filter((x) => x.column !== c.column), c];
    try {
      const next = await firstValueFrom(this.api.confirmIdentifiers(id, d.id, all));
      this.datasets.update((list) => list.map((x) => (x.id === next.id ? next : x)));
    } catch (err) {
      this.identifierError.set(`Not recorded. ${toApiProblem(err).message}`);
    } finally {
      this.busy.set(false);
    }
  }

  /** Opens the wide-to-long dialog; the long copy becomes the current dataset. */
  protected openReshape(): void {
    const id = this.requestId();
    const dataset = this.current();
    if (!id || !dataset) return;
    this.dialog.open<ReshapeDialog, ReshapeDialogData, DatasetPreview>(ReshapeDialog, { data: { requestId: id, dataset }, autoFocus: 'first-tabbable' })
      .afterClosed().subscribe((d) => {
        if (!d) return;
        this.datasets.update((list) => [...list, d]);
        this.notice.set(`The long copy "${d.filename}" has ${d.rows} rows; map its columns below.`);
      });
  }

  /** Factor columns chosen in the mapping, for the multi-selects. */
  protected factorColumns(kind: 'between' | 'within'): string[] {
    return this.design().controls[kind].controls.map((f) => f.controls.column.value).filter((c) => c !== '');
  }

  /** Syncs factor rows with a multi-select, keeping levels already typed for columns that stay. */
  protected setFactorColumns(kind: 'between' | 'within', columns: string[]): void {
    const arr = this.design().controls[kind];
    const keep = new Map(arr.controls.map((f) => [f.controls.column.value, f.controls.levels.value]));
    arr.clear({ emitEvent: false });
    for (const c of columns) {
      const col = this.current()?.columns.find((x) => x.name === c);
      const fromData = col && col.distinct <= col.examples.length ? col.examples.join(', ') : '';
      arr.push(factorForm(c, keep.get(c) ?? fromData), { emitEvent: false });
    }
    arr.updateValueAndValidity();
  }

  /** Problem text for a key. */
  protected problem(key: string): string {
    return this.problems()[key] ?? '';
  }
}
