import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { AuditEntry, Page, Role, RoleMapping, UserAdminRow } from '../../../shared/api/types';
import { toQueryParams } from '../api-client/query-params';

/** Body of POST /api/admin/users: a new local account. */
export interface NewLocalAccount {
  name: string;
  email: string;
  department: string;
  password: string;
  roles: Role[];
}

/** Filters of GET /api/audit. Dates are yyyy-mm-dd, inclusive. */
export interface AuditQuery {
  actor: string;
  action: string;
  entityType: string;
  from: string;
  to: string;
  page: number;
  pageSize: number;
}

/** Administration calls: people and roles, sign-in mappings, the audit log. */
@Injectable({ providedIn: 'root' })
export class AdminService {
  private readonly http = inject(HttpClient);

  /** GET /api/admin/users?q=&page=&pageSize= */
  users(q: string, page: number, pageSize: number): Observable<Page<UserAdminRow>> {
    return this.http.get<Page<UserAdminRow>>('/api/admin/users', { params: toQueryParams({ q: q.trim(), page, pageSize }) });
  }

  /** PATCH /api/admin/users/:id with the full new role list and the version read; 409 when stale. */
  setRoles(user: UserAdminRow, roles: Role[]): Observable<UserAdminRow> {
    return this.http.patch<UserAdminRow>(`/api/admin/users/${encodeURIComponent(user.id)}`, { roles, version: user.version });
  }

  /** POST /api/admin/users */
  createLocalAccount(account: NewLocalAccount): Observable<UserAdminRow> {
    return this.http.post<UserAdminRow>('/api/admin/users', account);
  }

  /** GET /api/admin/role-mappings */
  mappings(): Observable<RoleMapping[]> {
    return this.http.get<RoleMapping[]>('/api/admin/role-mappings');
  }

  /** POST /api/admin/role-mappings */
  addMapping(mapping: Omit<RoleMapping, 'id'>): Observable<RoleMapping> {
    return this.http.post<RoleMapping>('/api/admin/role-mappings', mapping);
  }

  /** DELETE /api/admin/role-mappings/:id */
  removeMapping(id: string): Observable<unknown> {
    return this.http.delete(`/api/admin/role-mappings/${encodeURIComponent(id)}`);
  }

  /** GET /api/audit?actor=&action=&entityType=&from=&to=&page=&pageSize= */
  audit(query: AuditQuery): Observable<Page<AuditEntry>> {
    return this.http.get<Page<AuditEntry>>('/api/audit', { params: toQueryParams(query) });
  }
}
