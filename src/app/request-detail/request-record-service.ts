import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { RequestDetail } from '../../../shared/api/types';
import type { RequestVersionDetail } from '../../../shared/api/filing-types';
import type { DecisionView, LetterView, RequestVersionSummary } from '../../../shared/api/workflow';

const base = (id: string) => `/api/requests/${encodeURIComponent(id)}`;

/** Reads a request's history and outcome (versions, decision, letters) and withdraws it. */
@Injectable({ providedIn: 'root' })
export class RequestRecordService {
  private readonly http = inject(HttpClient);

  /** GET /api/requests/:id/versions */
  versions(id: string): Observable<RequestVersionSummary[]> {
    return this.http.get<RequestVersionSummary[]>(`${base(id)}/versions`);
  }

  /** GET /api/requests/:id/versions/:n */
  version(id: string, n: number): Observable<RequestVersionDetail> {
    return this.http.get<RequestVersionDetail>(`${base(id)}/versions/${n}`);
  }

  /** GET /api/requests/:id/decision (404 when there is none yet). */
  decision(id: string): Observable<DecisionView> {
    return this.http.get<DecisionView>(`${base(id)}/decision`);
  }

  /** GET /api/requests/:id/letters */
  letters(id: string): Observable<LetterView[]> {
    return this.http.get<LetterView[]>(`${base(id)}/letters`);
  }

  /** POST /api/requests/:id/withdraw */
  withdraw(id: string, version: number, reason: string): Observable<RequestDetail> {
    return this.http.post<RequestDetail>(`${base(id)}/withdraw`, { version, reason });
  }

  /** Download address of a stored data file. */
  datasetFileUrl(id: string, datasetId: string): string {
    return `${base(id)}/datasets/${encodeURIComponent(datasetId)}/file`;
  }
}
