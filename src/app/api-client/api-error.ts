import { HttpErrorResponse } from '@angular/common/http';
import type { ApiError } from '../../../shared/api/types';

/** A failed API call reduced to what a screen shows: a sentence, a status and per-field messages. */
export interface ApiProblem {
  status: number;
  code: string;
  message: string;
  fields: Record<string, string>;
}

/** Turns any error from HttpClient into an {@link ApiProblem} with a human message. */
export function toApiProblem(err: unknown): ApiProblem {
  if (err instanceof HttpErrorResponse) {
    const body = err.error as Partial<ApiError> | null;
    const e = body && typeof body === 'object' ? body.error : undefined;
    if (e && typeof e.message === 'string') {
      return { status: err.status, code: e.code ?? 'error', message: e.message, fields: e.fields ?? {} };
    }
    return { status: err.status, code: 'http', message: fallbackMessage(err.status), fields: {} };
  }
  return { status: 0, code: 'client', message: 'Something went wrong in the page. Reload and try again.', fields: {} };
}

function fallbackMessage(status: number): string {
  if (status === 0) return 'The server could not be reached. Check your connection and try again.';
  if (status === 401) return 'Your session has ended. Sign in again.';
  if (status === 403) return 'Your roles do not allow this.';
  if (status === 404) return 'This item does not exist or is no longer available to you.';
  if (status === 409) return 'Someone else changed this in the meantime.';
  if (status === 429) return 'Too many attempts in a short time. Wait a moment and try again.';
  if (status >= 500) return 'The server had a problem. Try again in a moment.';
  return `The request failed (HTTP ${status}).`;
}
