import { HttpClient, HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { DepartmentRef, PersonRef, RequestDetail } from '../../../shared/api/types';
import type { DatasetPreview, OfficeSettings, ReshapeBody } from '../../../shared/api/workflow';
import type { DraftPatch } from './filing-draft';

/** GET /api/requests/:id/revision-request */
export interface RevisionRequestView {
  changes: string[];
  message: string;
  requestedBy: PersonRef | null;
  requestedAt: string;
}

const base = (id: string) => `/api/requests/${encodeURIComponent(id)}`;

/** Talks to the filing endpoints: drafts, datasets, identifier confirmations and submission. */
@Injectable({ providedIn: 'root' })
export class FilingService {
  private readonly http = inject(HttpClient);

  /** GET /api/requests/:id */
  load(id: string): Observable<RequestDetail> {
    return this.http.get<RequestDetail>(base(id));
  }

  /** POST /api/requests: starts a draft (the title is required). */
  create(fields: Omit<DraftPatch, 'version'>): Observable<RequestDetail> {
    return this.http.post<RequestDetail>('/api/requests', fields);
  }

  /** PATCH /api/requests/:id with the version last read (409 when stale). */
  save(id: string, patch: DraftPatch): Observable<RequestDetail> {
    return this.http.patch<RequestDetail>(base(id), patch);
  }

  /** GET /api/departments */
  departments(): Observable<DepartmentRef[]> {
    return this.http.get<DepartmentRef[]>('/api/departments');
  }

  /** GET /api/office/settings (for the default alpha). */
  officeSettings(): Observable<OfficeSettings> {
    return this.http.get<OfficeSettings>('/api/office/settings');
  }

  /** GET /api/requests/:id/datasets */
  datasets(id: string): Observable<DatasetPreview[]> {
    return this.http.get<DatasetPreview[]>(`${base(id)}/datasets`);
  }

  /** POST /api/requests/:id/datasets (multipart field `file`), reporting upload progress events. */
  upload(id: string, file: File): Observable<HttpEvent<DatasetPreview>> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.http.post<DatasetPreview>(`${base(id)}/datasets`, form, { reportProgress: true, observe: 'events' });
  }

  /** POST /api/requests/:id/datasets/:datasetId/reshape: a long copy of a wide file. */
  reshape(id: string, datasetId: string, body: ReshapeBody): Observable<DatasetPreview> {
    return this.http.post<DatasetPreview>(`${base(id)}/datasets/${encodeURIComponent(datasetId)}/reshape`, body);
  }

  /** POST /api/requests/:id/datasets/:datasetId/identifiers: the submitter says why flagged columns are needed. */
  confirmIdentifiers(id: string, datasetId: string, confirmations: { column: string; reason: string }[]): Observable<DatasetPreview> {
    return this.http.post<DatasetPreview>(`${base(id)}/datasets/${encodeURIComponent(datasetId)}/identifiers`, { confirmations });
  }

  /** GET /api/requests/:id/revision-request: the reviewer's required changes (404 when none). */
  revisionRequest(id: string): Observable<RevisionRequestView> {
    return this.http.get<RevisionRequestView>(`${base(id)}/revision-request`);
  }

  /** DELETE /api/requests/:id/datasets/:datasetId */
  deleteDataset(id: string, datasetId: string): Observable<unknown> {
    return this.http.delete(`${base(id)}/datasets/${encodeURIComponent(datasetId)}`);
  }

  /** POST /api/requests/:id/submit: the server validates the whole plan against the data by a dry run. */
  submit(id: string, version: number, note?: string): Observable<RequestDetail> {
    return this.http.post<RequestDetail>(`${base(id)}/submit`, note ? { version, note } : { version });
  }
}
