import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import type { ServerInfo } from './server-info';

/** Loads GET /api/health once and keeps it as a signal (office name, demo mode). */
@Injectable({ providedIn: 'root' })
export class ServerInfoService {
  private readonly http = inject(HttpClient);
  private requested = false;

  /** The last health answer, or null before it arrives or when the call failed. */
  readonly info = signal<ServerInfo | null>(null);

  /** Starts the request the first time it is called; later calls do nothing. */
  ensureLoaded(): void {
    if (this.requested) return;
    this.requested = true;
    this.http.get<ServerInfo>('/api/health').subscribe({
      next: (info) => this.info.set(info),
      // A degraded server answers 503 with the same body; keep it so the office name still shows.
      error: (err) => {
        if (err?.error && typeof err.error === 'object' && 'status' in err.error) this.info.set(err.error as ServerInfo);
        this.requested = false;
      },
    });
  }
}
