import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { Page, RequestSummary } from '../../../shared/api/types';
import type { AssignBody, AssignmentCandidate, DeclineBody } from '../../../shared/api/workflow';
import { toQueryParams } from '../api-client/query-params';

/** Intake calls: requests waiting for a reviewer, candidates, assigning and declining. */
@Injectable({ providedIn: 'root' })
export class IntakeService {
  private readonly http = inject(HttpClient);

  /** Filed requests without a reviewer, oldest filing first (GET /api/requests?scope=intake&state=filed). */
  waiting(pageSize = 50): Observable<Page<RequestSummary>> {
    const params = toQueryParams({ scope: 'intake', state: 'filed', sort: 'filedAt', dir: 'asc', page: 0, pageSize });
    return this.http.get<Page<RequestSummary>>('/api/requests', { params });
  }

  /** GET /api/requests/:id/assignment/candidates */
  candidates(requestId: string): Observable<AssignmentCandidate[]> {
    return this.http.get<AssignmentCandidate[]>(`/api/requests/${encodeURIComponent(requestId)}/assignment/candidates`);
  }

  /** PUT /api/requests/:id/assignment */
  assign(requestId: string, body: AssignBody): Observable<unknown> {
    return this.http.put(`/api/requests/${encodeURIComponent(requestId)}/assignment`, body);
  }

  /** POST /api/requests/:id/assignment/decline (the assigned reviewer). */
  decline(requestId: string, body: DeclineBody): Observable<unknown> {
    return this.http.post(`/api/requests/${encodeURIComponent(requestId)}/assignment/decline`, body);
  }
}
