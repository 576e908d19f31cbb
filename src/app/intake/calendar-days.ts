/** Today's date in the browser's time zone as YYYY-MM-DD (what a date input holds). */
export function todayIso(now: Date = new Date()): string {
  return isoDate(now);
}

/** A calendar date `days` after `fromIso` (YYYY-MM-DD), as YYYY-MM-DD. */
export function addDaysIso(fromIso: string, days: number): string {
  const [y, m, d] = fromIso.split('-').map(Number);
  // Noon avoids a daylight-saving change moving the date by one.
  return isoDate(new Date(y!, m! - 1, d! + days, 12));
}

/** Whole days from an ISO timestamp until `now` (0 on the same day; never negative). */
export function daysSince(iso: string, now: Date = new Date()): number {
  const then = new Date(iso);
  const a = Date.UTC(then.getFullYear(), then.getMonth(), then.getDate());
  const b = Date.UTC(now.getFullYear(), now.getMonth(), now.getDate());
  return Math.max(0, Math.round((b - a) / 86_400_000));
}

/** Whole calendar days from `now` until an ISO date (negative when past). */
export function daysUntil(iso: string, now: Date = new Date()): number {
  const then = new Date(iso.length === 10 ? `${iso}T12:00:00` : iso);
  const a = Date.UTC(now.getFullYear(), now.getMonth(), now.getDate());
  const b = Date.UTC(then.getFullYear(), then.getMonth(), then.getDate());
  return Math.round((b - a) / 86_400_000);
}

function isoDate(d: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}
