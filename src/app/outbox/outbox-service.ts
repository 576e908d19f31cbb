import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { OutboxMail } from '../../../shared/api/workflow';

/** Reads the e-mails caught by the local development mail catcher (GET /api/admin/outbox). */
@Injectable({ providedIn: 'root' })
export class OutboxService {
  private readonly http = inject(HttpClient);

  /** Caught mails, as the server orders them; 404 when mail does not go to the local catcher. */
  list(): Observable<OutboxMail[]> {
    return this.http.get<OutboxMail[]>('/api/admin/outbox');
  }
}
