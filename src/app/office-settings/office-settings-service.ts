import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { OfficeSettings } from '../../../shared/api/workflow';

/** Reads and saves the office settings (GET/PUT /api/office/settings). */
@Injectable({ providedIn: 'root' })
export class OfficeSettingsService {
  private readonly http = inject(HttpClient);

  /** GET /api/office/settings */
  get(): Observable<OfficeSettings> {
    return this.http.get<OfficeSettings>('/api/office/settings');
  }

  /** PUT /api/office/settings (head only; carries the version it was read at). */
  save(settings: OfficeSettings): Observable<OfficeSettings> {
    return this.http.put<OfficeSettings>('/api/office/settings', settings);
  }
}
