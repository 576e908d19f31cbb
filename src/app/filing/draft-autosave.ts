import { signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { toApiProblem } from '../api-client/api-error';
import { changedFields, type DraftDetail, type DraftFields } from './filing-draft';
import { splitSaveable } from './saveable-fields';
import type { FilingService } from './filing-service';

/** What the save indicator says. */
export type SaveStatus = 'idle' | 'needs-title' | 'pending' | 'saving' | 'saved' | 'conflict' | 'error';

/** Delay after the last keystroke before a draft is saved. */
export const AUTOSAVE_DELAY_MS = 1200;

/**
 * Saves a draft a moment after the person stops typing: creates it on the first save that
 * has a title, then PATCHes only the changed fields with the version last read. A 409 stops
 * saving (the form keeps everything typed) until the person reloads; other failures retry on
 * the next change. Saves never overlap: a change during a save is saved right after it.
 */
export class DraftAutosave {
  /** Current state of saving, for the status line. */
  readonly status = signal<SaveStatus>('idle');
  /** When the last save succeeded. */
  readonly savedAt = signal<Date | null>(null);
  /** Why the last save failed, in plain words. */
  readonly message = signal('');
  /** Per-field messages of the last rejected save (API field paths). */
  readonly fieldErrors = signal<Record<string, string>>({});
  /** The request id once the draft exists. */
  readonly requestId = signal<string | null>(null);
  /** Version last read from the server. */
  readonly version = signal(0);

  private baseline: DraftFields | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private running: Promise<void> | null = null;
  private again = false;

  constructor(
    private readonly api: FilingService,
    private readonly read: () => DraftFields,
    private readonly onSaved: (detail: DraftDetail, created: boolean) => void = () => {},
    private readonly delayMs = AUTOSAVE_DELAY_MS,
  ) {}

  /** Starts from a loaded request: its id, version and saved fields. */
  startFrom(detail: DraftDetail, saved: DraftFields): void {
    this.requestId.set(detail.id);
    this.version.set(detail.version);
    this.baseline = saved;
    this.status.set('idle');
  }

  /** Call on every change: saves after the pause, unless saving is stopped by a conflict. */
  schedule(): void {
    if (this.status() === 'conflict') return;
    this.cancelTimer();
    this.status.set('pending');
    this.timer = setTimeout(() => { this.timer = null; void this.saveNow(); }, this.delayMs);
  }

  /** Saves whatever is pending now and resolves when the draft is saved (true) or saving failed (false). */
  async flush(): Promise<boolean> {
    if (this.status() === 'conflict') return false;
    this.cancelTimer();
    await this.saveNow();
    while (this.running) await this.running;
    const s = this.status();
    return s === 'saved' || s === 'idle';
  }

  /** Stops the timer (on leaving the page). */
  dispose(): void {
    this.cancelTimer();
  }

  private cancelTimer(): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }

  private saveNow(): Promise<void> {
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = this.saveOnce().finally(() => {
      this.running = null;
      if (this.again && this.status() !== 'conflict') {
        this.again = false;
        void this.saveNow();
      }
    });
    return this.running;
  }

  private async saveOnce(): Promise<void> {
    const fields = this.read();
    const id = this.requestId();
    if (!id && !fields.title) {
      this.status.set('needs-title');
      return;
    }
    const diff = changedFields(this.baseline, fields);
    if (id && Object.keys(diff).length === 0) {
      this.status.set(this.savedAt() ? 'saved' : 'idle');
      return;
    }
    this.status.set('saving');
    try {
      let detail: DraftDetail;
      if (!id) {
        // The create body has no reported results; they follow in the next PATCH.
        // Without a chosen department the server files the draft under the person's own.
        const { reported: _reported, departmentId, ...rest } = fields;
        const createBody = departmentId ? { ...rest, departmentId } : rest;
        detail = await firstValueFrom(this.api.create(createBody));
        this.baseline = { ...fields, reported: [] };
        this.requestId.set(detail.id);
        if (fields.reported.length) this.again = true;
      } else {
        // Fields that would fail validation stay unsent (and on screen) so the rest still saves.
        const { ok, problems } = splitSaveable(diff);
        if (Object.keys(ok).length) {
          detail = await firstValueFrom(this.api.save(id, { ...ok, version: this.version() }));
          this.baseline = { ...(this.baseline ?? fields), ...ok };
        } else {
          this.reportUnsaved(problems);
          return;
        }
        if (Object.keys(problems).length) {
          this.version.set(detail.version);
          this.onSaved(detail, false);
          this.reportUnsaved(problems);
          return;
        }
      }
      this.version.set(detail.version);
      this.savedAt.set(new Date());
      this.message.set('');
      this.fieldErrors.set({});
      this.status.set('saved');
      this.onSaved(detail, !id);
    } catch (err) {
      const p = toApiProblem(err);
      this.message.set(p.message);
      this.fieldErrors.set(p.fields);
      this.status.set(p.status === 409 ? 'conflict' : 'error');
    }
  }

  private reportUnsaved(problems: Record<string, string>): void {
    this.fieldErrors.set(problems);
    this.message.set(`Some fields are not saved until corrected: ${Object.values(problems).join(' ')}`);
    this.status.set('error');
  }
}
