import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, of, throwError } from 'rxjs';
import type { VerificationView } from '../../../shared/api/workflow';

const STATUSES = new Set(['valid-current', 'valid-superseded', 'altered', 'unknown-code', 'not-a-pdf']);

/** True when an error body is itself a verification answer (the API may send "unknown code" with 404). */
function asVerification(err: unknown): VerificationView | null {
  if (!(err instanceof HttpErrorResponse)) return null;
  const b = err.error as Partial<VerificationView> | null;
  return b && typeof b === 'object' && typeof b.status === 'string' && STATUSES.has(b.status) ? (b as VerificationView) : null;
}

/** The public verification API (no sign-in). */
@Injectable({ providedIn: 'root' })
export class VerifyService {
  private readonly http = inject(HttpClient);

  /** GET /api/letters/:code */
  byCode(code: string): Observable<VerificationView> {
    return this.http.get<VerificationView>(`/api/letters/${encodeURIComponent(code)}`).pipe(catchError((e: unknown) => this.answerOrThrow(e)));
  }

  /** POST /api/letters/verify with the PDF as multipart field `file`. */
  byFile(file: File): Observable<VerificationView> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.http.post<VerificationView>('/api/letters/verify', form).pipe(catchError((e: unknown) => this.answerOrThrow(e)));
  }

  private answerOrThrow(e: unknown): Observable<VerificationView> {
    const v = asVerification(e);
    return v ? of(v) : throwError(() => e);
  }
}
