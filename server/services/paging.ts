/** Helpers for paged list endpoints. */
import type { Page } from '../../shared/api/types';

/** LIMIT/OFFSET for a 0-based page. */
export function limits(page: number, pageSize: number): { limit: number; offset: number } {
  return { limit: pageSize, offset: page * pageSize };
}

/** Wraps rows into the Page shape. */
export function toPage<T>(items: T[], total: number, page: number, pageSize: number): Page<T> {
  return { items, total, page, pageSize };
}

/** Escapes LIKE wildcards in user input and wraps it for a contains-match. */
export function likeContains(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** ISO string of a date, or null. */
export const iso = (d: Date | null | undefined): string | null => (d ? new Date(d).toISOString() : null);
