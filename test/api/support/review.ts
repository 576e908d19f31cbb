/**
 * Helpers for tests of the review routes: waiting for a rerun, reading its server-sent
 * events, and recording checklist verdicts.
 */
import { expect } from 'vitest';
import { CRITERIA, type Criterion, type Verdict } from '../../../shared/api/types';
import type { ApiClient } from './client';

/** One parsed server-sent event. */
export interface SseEvent { event: string; data: Record<string, unknown> }

/** Polls GET /api/reruns/:id until the rerun is done or failed; returns the detail. */
export async function waitForRerun(c: ApiClient, id: string, timeoutMs = 60_000): Promise<any> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await c.get(`/api/reruns/${id}`);
    expect(res.status, res.text).toBe(200);
    if (res.body.status === 'done' || res.body.status === 'failed') return res.body;
    if (Date.now() > until) throw new Error(`rerun ${id} still ${res.body.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Reads GET /api/reruns/:id/events to its end and parses the events (comments and retry lines skipped). */
export async function readEvents(c: ApiClient, id: string): Promise<{ status: number; contentType: string; events: SseEvent[]; raw: string }> {
  const res = await c.agent
    .get(`/api/reruns/${id}/events`)
    .buffer(true)
    .parse((stream, done) => {
      let text = '';
      stream.setEncoding('utf8');
      stream.on('data', (chunk: string) => { text += chunk; });
      stream.on('end', () => done(null, text));
    });
  const raw = String(res.body ?? '');
  const events: SseEvent[] = [];
  for (const block of raw.split('\n\n')) {
    const lines = block.split('\n');
    const ev = lines.find((l) => l.startsWith('event: '))?.slice(7);
    const data = lines.find((l) => l.startsWith('data: '))?.slice(6);
    if (ev && data) events.push({ event: ev, data: JSON.parse(data) as Record<string, unknown> });
  }
  return { status: res.status, contentType: String(res.headers['content-type'] ?? ''), events, raw };
}

/** Starts a rerun and returns its 202 body. */
export async function startRerun(c: ApiClient, requestId: string, body: Record<string, unknown> = {}): Promise<any> {
  const res = await c.send('post', `/api/requests/${requestId}/reruns`, body);
  expect(res.status, res.text).toBe(202);
  return res.body;
}

/** Records a verdict on every criterion (reading each entry's version first). */
export async function judgeAll(c: ApiClient, requestId: string, verdictFor: (c: Criterion) => Verdict = () => 'met'): Promise<void> {
  const list = await c.get(`/api/requests/${requestId}/checklist`);
  expect(list.status, list.text).toBe(200);
  for (const criterion of CRITERIA) {
    const entry = (list.body as { criterion: string; version: number }[]).find((e) => e.criterion === criterion)!;
    const res = await c.send('put', `/api/requests/${requestId}/checklist/${criterion}`, { verdict: verdictFor(criterion), note: `Checked ${criterion}.`, version: entry.version });
    expect(res.status, res.text).toBe(200);
  }
}
