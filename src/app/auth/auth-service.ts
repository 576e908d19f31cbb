import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Router } from '@angular/router';
import { Observable, firstValueFrom, tap } from 'rxjs';
import type { Me, Role } from '../../../shared/api/types';

/** Who is signed in, kept as signals; signs in and out through the API. */
@Injectable({ providedIn: 'root' })
export class AuthService {
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private pending: Promise<Me | null> | null = null;

  /** The signed-in person, or null. */
  readonly me = signal<Me | null>(null);
  /** True while GET /api/auth/me is in flight. */
  readonly loading = signal(false);
  /** True once the first GET /api/auth/me has answered (either way). */
  readonly checked = signal(false);
  /** Roles of the signed-in person (empty when signed out). */
  readonly roles = computed<readonly Role[]>(() => this.me()?.roles ?? []);

  /** Whether the signed-in person holds any of the given roles. */
  hasAnyRole(roles: readonly Role[]): boolean {
    const mine = this.roles();
    return roles.some((r) => mine.includes(r));
  }

  /**
   * Asks the server who is signed in, once; later calls reuse the answer.
   * This first GET also gives the browser its XSRF-TOKEN cookie for later mutating calls.
   */
  ensureLoaded(): Promise<Me | null> {
    if (this.checked()) return Promise.resolve(this.me());
    this.pending ??= this.fetchMe();
    return this.pending;
  }

  /** Asks the server again (after sign-in elsewhere, or a role change). */
  refresh(): Promise<Me | null> {
    this.pending = this.fetchMe();
    return this.pending;
  }

  /** Local sign-in with e-mail and password; sets {@link me} on success. */
  signIn(email: string, password: string): Observable<Me> {
    return this.http.post<Me>('/api/auth/login', { email, password }).pipe(
      tap((me) => {
        this.me.set(me);
        this.checked.set(true);
      }),
    );
  }

  /** Ends the session on the server and returns to the sign-in page. */
  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.post('/api/auth/logout', {}));
    } finally {
      this.forget();
      await this.router.navigateByUrl('/sign-in');
    }
  }

  /** Drops the local copy of the session (after a 401). */
  forget(): void {
    this.me.set(null);
    this.checked.set(true);
    this.pending = null;
  }

  private async fetchMe(): Promise<Me | null> {
    this.loading.set(true);
    try {
      const me = await firstValueFrom(this.http.get<Me>('/api/auth/me'));
      this.me.set(me);
      return me;
    } catch (err) {
      if (!(err instanceof HttpErrorResponse) || err.status !== 401) console.error('Could not check the session', err);
      this.me.set(null);
      return null;
    } finally {
      this.loading.set(false);
      this.checked.set(true);
    }
  }
}
