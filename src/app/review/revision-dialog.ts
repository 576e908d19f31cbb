import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';

/** What the dialog returns: the changes and the message (the caller adds the version). */
export interface RevisionAnswer {
  changes: string[];
  message: string;
}

/** Asks for a revision: a list of required changes, one per line item, and a message to the submitter. */
@Component({
  selector: 'as-revision-dialog',
  imports: [MatButtonModule, MatDialogModule, MatIconModule],
  template: `
    <h2 mat-dialog-title>Ask for a revision of {{ data.reference }}</h2>
    <mat-dialog-content>
      <p class="lede">The submitter gets these changes by e-mail and on the request page. Each item should be one thing they can do.</p>
      <fieldset>
        <legend>Required changes</legend>
        <ol class="changes">
          @for (c of changes(); track $index; let i = $index) {
            <li>
              <label class="as-visually-hidden" [for]="'chg-' + i">Change {{ i + 1 }}</label>
              <input [id]="'chg-' + i" [value]="c" (input)="set(i, $any($event.target).value)" placeholder="e.g. Report Welch's test instead of the pooled t test" />
              <button mat-icon-button type="button" (click)="remove(i)" [disabled]="changes().length === 1" [attr.aria-label]="'Remove change ' + (i + 1)"><mat-icon>close</mat-icon></button>
            </li>
          }
        </ol>
        <button mat-button type="button" (click)="add()"><mat-icon aria-hidden="true">add</mat-icon>Add a change</button>
      </fieldset>
      <label for="rev-msg" class="lbl">Message to the submitter (optional)</label>
      <textarea id="rev-msg" rows="4" [value]="message()" (input)="message.set($any($event.target).value)"></textarea>
      @if (tried() && !filled().length) { <p class="error" role="alert">List at least one required change.</p> }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="button" (click)="send()">Send the revision request</button>
    </mat-dialog-actions>
  `,
  styles: `
    .lede { margin-top: 0; }
    fieldset { border: none; padding: 0; margin: 0 0 12px; } legend { font-weight: 600; margin-bottom: 4px; }
    .changes { margin: 0; padding-left: 22px; display: grid; gap: 6px; li { display: flex; gap: 4px; align-items: center; } }
    input, textarea { flex: 1; font: inherit; padding: 8px; border: 1px solid var(--mat-sys-outline); border-radius: 6px; width: 100%; box-sizing: border-box; }
    .lbl { display: block; font-weight: 600; margin-bottom: 4px; }
    .error { color: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionDialog {
  protected readonly data = inject<{ reference: string }>(MAT_DIALOG_DATA);
  private readonly ref = inject(MatDialogRef<RevisionDialog, RevisionAnswer>);
  protected readonly changes = signal<string[]>(['']);
  protected readonly message = signal('');
  protected readonly tried = signal(false);

  /** Non-empty change lines. */
  protected filled(): string[] {
    return this.changes().map((c) => c.trim()).filter(Boolean);
  }
  protected set(i: number, v: string): void { this.changes.update((l) => l.map((c, j) => (j === i ? v : c))); }
  protected add(): void { this.changes.update((l) => [...l, '']); }
  protected remove(i: number): void { this.changes.update((l) => l.filter((_, j) => j !== i)); }

  /** Closes with the answer when at least one change is listed. */
  protected send(): void {
    this.tried.set(true);
    if (this.filled().length) this.ref.close({ changes: this.filled(), message: this.message().trim() });
  }
}
