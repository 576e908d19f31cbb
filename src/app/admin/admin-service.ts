import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { AuditEntry, DepartmentRef, Page, Role, RoleMapping, UserAdminRow } from '../../../shared/api/types';
import { toQueryParams } from '../api-client/query-params';

/** Body of POST /api/admin/users: a new local account. */
export interface NewLocalAccount {
  name: string;
  email: string;
  /** Department id from GET /api/departments, or null. */
  departmentId: string | null;
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

  /** PUT /api/admin/role-mappings: the full list replaces the office's mappings; returns the stored list. */
  replaceMappings(mappings: Omit<RoleMapping, 'id'>[]): Observable<RoleMapping[]> {
    const body = { mappings: mappings.map(({ attribute, value, role }) => ({ attribute, value, role })) };
    return this.http.put<RoleMapping[]>('/api/admin/role-mappings', body);
  }

  /** GET /api/departments, for the department choice of a new account. */
  departments(): Observable<DepartmentRef[]> {
    return this.http.get<DepartmentRef[]>('/api/departments');
  }

  /** GET /api/audit?actor=&action=&entity=&from=&to=&page=&pageSize= */
  audit(query: AuditQuery): Observable<Page<AuditEntry>> {
    const { entityType, ...rest } = query;
    return this.http.get<Page<AuditEntry>>('/api/audit', { params: toQueryParams({ ...rest, entity: entityType }) });
  }
}
