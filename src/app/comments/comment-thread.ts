import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, OnInit, inject, input, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import type { CommentView } from '../../../shared/api/workflow';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { LoadError } from '../page-state/load-error';
import { CommentService } from './comment-service';
import { listSelection, markdownLiteToHtml, wrapSelection } from './markdown-lite';

/** The comment thread of one request, with a small formatting composer and internal notes for office staff. */
@Component({
  selector: 'as-comment-thread',
  imports: [DatePipe, MatButtonModule, MatCheckboxModule, MatIconModule, LoadError],
  templateUrl: './comment-thread.html',
  styleUrl: './comment-thread.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommentThread implements OnInit {
  private readonly comments = inject(CommentService);
  private readonly destroyRef = inject(DestroyRef);
  private readonly announcer = inject(LiveAnnouncer);

  /** The request whose thread this is. */
  readonly requestId = input.required<string>();
  /** Whether the viewer may write internal notes (reviewers and the head). */
  readonly allowInternal = input(false);

  protected readonly items = signal<CommentView[]>([]);
  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly text = signal('');
  protected readonly internal = signal(false);
  protected readonly posting = signal(false);
  protected readonly postError = signal<string | null>(null);
  private readonly box = viewChild<ElementRef<HTMLTextAreaElement>>('box');

  ngOnInit(): void {
    this.load();
  }

  /** Fetches the thread (again). */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.comments.list(this.requestId()).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (list) => { this.items.set(list); this.loading.set(false); },
      error: (err: unknown) => { this.problem.set(toApiProblem(err)); this.loading.set(false); },
    });
  }

  /** Applies a toolbar action to the current selection. */
  protected format(kind: 'bold' | 'italic' | 'list' | 'link'): void {
    const el = this.box()?.nativeElement;
    if (!el) return;
    const { selectionStart: s, selectionEnd: e, value } = el;
    const next =
      kind === 'bold' ? wrapSelection(value, s, e, '**') :
      kind === 'italic' ? wrapSelection(value, s, e, '*') :
      kind === 'list' ? listSelection(value, s, e) :
      wrapSelection(value, s, e, '[', '](https://)', 'link text');
    el.value = next.value;
    this.text.set(next.value);
    el.focus();
    el.setSelectionRange(next.start, next.end);
  }

  /** Posts the composer's text; keeps it in the box if posting fails. */
  protected post(): void {
    const body = this.text().trim();
    if (!body || this.posting()) return;
    this.posting.set(true);
    this.postError.set(null);
    const internal = this.allowInternal() && this.internal();
    this.comments.add(this.requestId(), { body: markdownLiteToHtml(body), internal }).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (c) => {
        this.items.update((list) => [...list, c]);
        this.text.set('');
        this.internal.set(false);
        this.posting.set(false);
        void this.announcer.announce(internal ? 'Internal note added.' : 'Comment added.');
      },
      error: (err: unknown) => {
        this.postError.set(toApiProblem(err).message);
        this.posting.set(false);
      },
    });
  }

  /** Ctrl/⌘+Enter posts. */
  protected onKey(ev: KeyboardEvent): void {
    if (ev.key === 'Enter' && (ev.ctrlKey || ev.metaKey)) { ev.preventDefault(); this.post(); }
  }
}
