import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { Page, RequestDetail, RequestState, RequestSummary } from '../../../shared/api/types';
import { toQueryParams } from '../api-client/query-params';

/** Which list of requests a table shows; the server decides what each scope contains for the caller. */
export type RequestScope = 'mine' | 'assigned' | 'intake';

/** Query of GET /api/requests: the common list query plus scope and state filter. */
export interface RequestListQuery {
  scope: RequestScope;
  q: string;
  /** Empty means every state. Sent comma-separated as `state`. */
  states: RequestState[];
  sort: string;
  dir: 'asc' | 'desc' | '';
  /** 0-based. */
  page: number;
  pageSize: number;
}

/** Reads review requests from the API. */
@Injectable({ providedIn: 'root' })
export class RequestService {
  private readonly http = inject(HttpClient);

  /** GET /api/requests?scope=&q=&state=&sort=&dir=&page=&pageSize= */
  list(query: RequestListQuery): Observable<Page<RequestSummary>> {
    const { scope, q, states, sort, dir, page, pageSize } = query;
    const params = toQueryParams({
      scope, q: q.trim(), state: states, sort: dir ? sort : '', dir, page, pageSize,
    });
    return this.http.get<Page<RequestSummary>>('/api/requests', { params });
  }

  /** GET /api/requests/:id */
  get(id: string): Observable<RequestDetail> {
    return this.http.get<RequestDetail>(`/api/requests/${encodeURIComponent(id)}`);
  }
}
