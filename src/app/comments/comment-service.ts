import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { CommentBody, CommentView } from '../../../shared/api/workflow';

/** Comments of one request. */
@Injectable({ providedIn: 'root' })
export class CommentService {
  private readonly http = inject(HttpClient);

  /** GET /api/requests/:id/comments (internal notes only for reviewers and the head). */
  list(requestId: string): Observable<CommentView[]> {
    return this.http.get<CommentView[]>(`/api/requests/${encodeURIComponent(requestId)}/comments`);
  }

  /** POST /api/requests/:id/comments */
  add(requestId: string, body: CommentBody): Observable<CommentView> {
    return this.http.post<CommentView>(`/api/requests/${encodeURIComponent(requestId)}/comments`, body);
  }
}
