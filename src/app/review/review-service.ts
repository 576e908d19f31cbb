import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { ReproduceResult } from '../../../shared/api/review-types';
import type { Criterion } from '../../../shared/api/types';
import type {
  ChecklistEntryView, ChecklistPutBody, DecisionBody, DecisionView, LetterView, RerunBody, RerunDetail, RerunSummary,
  RevisionRequestBody, SignBody,
} from '../../../shared/api/workflow';

/** Answer of POST /api/requests/:id/letter/sign and /countersign. */
export interface SignAnswer {
  letter: LetterView;
  /** How the signer confirmed (password or typed reference), in words. */
  message: string;
}

const enc = encodeURIComponent;

/** The reviewer's API calls: reruns, checklist, revision requests, decisions and letters. */
@Injectable({ providedIn: 'root' })
export class ReviewService {
  private readonly http = inject(HttpClient);

  /** GET /api/requests/:id/reruns */
  reruns(requestId: string): Observable<RerunSummary[]> {
    return this.http.get<RerunSummary[]>(`/api/requests/${enc(requestId)}/reruns`);
  }

  /** POST /api/requests/:id/reruns */
  startRerun(requestId: string, body: RerunBody): Observable<RerunSummary> {
    return this.http.post<RerunSummary>(`/api/requests/${enc(requestId)}/reruns`, body);
  }

  /** GET /api/reruns/:id */
  rerun(rerunId: string): Observable<RerunDetail> {
    return this.http.get<RerunDetail>(`/api/reruns/${enc(rerunId)}`);
  }

  /** POST /api/reruns/:id/reproduce: waits for the reproduction and compares the results. */
  reproduce(rerunId: string): Observable<ReproduceResult> {
    return this.http.post<ReproduceResult>(`/api/reruns/${enc(rerunId)}/reproduce`, {});
  }

  /** GET /api/requests/:id/checklist */
  checklist(requestId: string): Observable<ChecklistEntryView[]> {
    return this.http.get<ChecklistEntryView[]>(`/api/requests/${enc(requestId)}/checklist`);
  }

  /** PUT /api/requests/:id/checklist/:criterion (409 when the version is stale). */
  saveEntry(requestId: string, criterion: Criterion, body: ChecklistPutBody): Observable<ChecklistEntryView> {
    return this.http.put<ChecklistEntryView>(`/api/requests/${enc(requestId)}/checklist/${enc(criterion)}`, body);
  }

  /** POST /api/requests/:id/revision-request */
  requestRevision(requestId: string, body: RevisionRequestBody): Observable<unknown> {
    return this.http.post(`/api/requests/${enc(requestId)}/revision-request`, body);
  }

  /** GET /api/requests/:id/decision (404 before a decision). */
  decision(requestId: string): Observable<DecisionView> {
    return this.http.get<DecisionView>(`/api/requests/${enc(requestId)}/decision`);
  }

  /** POST /api/requests/:id/decision (422 lists the criteria still without a verdict). */
  decide(requestId: string, body: DecisionBody): Observable<DecisionView> {
    return this.http.post<DecisionView>(`/api/requests/${enc(requestId)}/decision`, body);
  }

  /** GET /api/requests/:id/letters */
  letters(requestId: string): Observable<LetterView[]> {
    return this.http.get<LetterView[]>(`/api/requests/${enc(requestId)}/letters`);
  }

  /** POST /api/requests/:id/letter/sign */
  sign(requestId: string, body: SignBody): Observable<SignAnswer> {
    return this.http.post<SignAnswer>(`/api/requests/${enc(requestId)}/letter/sign`, body);
  }

  /** POST /api/requests/:id/letter/countersign (office head). */
  countersign(requestId: string, body: SignBody): Observable<SignAnswer> {
    return this.http.post<SignAnswer>(`/api/requests/${enc(requestId)}/letter/countersign`, body);
  }
}
