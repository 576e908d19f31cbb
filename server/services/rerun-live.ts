/**
 * Live state of reruns in progress, kept in memory: the worker's progress goes here and
 * server-sent-event subscribers are told of every change. The stored row is the record;
 * this is only the moving part while a rerun runs in this process.
 */
import type { RerunEvent } from '../../shared/api/workflow';

/** A subscriber to one rerun's events. */
export type RerunListener = (event: RerunEvent) => void;

interface LiveRerun {
  state: RerunEvent;
  listeners: Set<RerunListener>;
}

const live = new Map<string, LiveRerun>();

/** Registers a rerun as live (queued). */
export function openLive(id: string): void {
  live.set(id, { state: { status: 'queued', progress: 0, stage: 'queued' }, listeners: new Set() });
}

/** The current live state, or null when the rerun is not running in this process. */
export function liveState(id: string): RerunEvent | null {
  return live.get(id)?.state ?? null;
}

/** Updates the live state and tells the subscribers; a final status closes the entry. */
export function publish(id: string, next: RerunEvent): void {
  const entry = live.get(id);
  if (!entry) return;
  entry.state = next;
  for (const l of [...entry.listeners]) l(next);
  if (next.status === 'done' || next.status === 'failed') live.delete(id);
}

/** Subscribes to a live rerun; returns the unsubscribe function, or null when it is not live. */
export function subscribe(id: string, listener: RerunListener): (() => void) | null {
  const entry = live.get(id);
  if (!entry) return null;
  entry.listeners.add(listener);
  return () => entry.listeners.delete(listener);
}

/** Number of subscribers of a live rerun (0 when none or not live); lets tests check clean-up. */
export function subscriberCount(id: string): number {
  return live.get(id)?.listeners.size ?? 0;
}
