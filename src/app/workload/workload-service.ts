import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { Workload } from '../../../shared/api/workflow';

/** Reads the head's workload board and saves a reviewer's own expertise. */
@Injectable({ providedIn: 'root' })
export class WorkloadService {
  private readonly http = inject(HttpClient);

  /** GET /api/workload (head). */
  workload(): Observable<Workload> {
    return this.http.get<Workload>('/api/workload');
  }

  /** GET /api/me/expertise: the signed-in reviewer's declared methods expertise. */
  myExpertise(): Observable<{ expertise: string[] }> {
    return this.http.get<{ expertise: string[] }>('/api/me/expertise');
  }

  /** PATCH /api/me/expertise (reviewer). */
  saveMyExpertise(expertise: string[]): Observable<{ expertise: string[] } | null> {
    return this.http.patch<{ expertise: string[] } | null>('/api/me/expertise', { expertise });
  }
}
