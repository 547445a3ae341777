/**
 * Runs the planner in a worker thread, so a long plan never blocks the process's event loop (the
 * HTTP server shares it). A plan over its time budget is stopped by terminating the thread.
 */
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';

import type { PlanCandidate } from '../../shared/contracts/plan.ts';
import type { PlanProgress } from './plan-maneuver.ts';
import type { PlannerThreadInput, PlannerThreadMessage } from './planner-messages.ts';

const ENTRY = fileURLToPath(new URL('./planner-entry.mjs', import.meta.url).href);

/** Longest a plan may run, ms (10 min). */
export const PLAN_TIME_BUDGET_MS = 10 * 60_000;

/** Thrown when the planner found no candidate; `notes` say why (which axis, which limit). */
export class PlanUnreachableError extends Error {
  constructor(message: string, readonly notes: string[]) { super(message); this.name = 'PlanUnreachableError'; }
}

/** What a finished plan gives: ranked candidates and the planner's notes. */
export interface PlannerThreadResult { candidates: PlanCandidate[]; notes: string[] }

/** Thrown when a plan was stopped through its AbortSignal (cancelled). */
export class PlanStoppedError extends Error {
  constructor() { super('planning stopped'); this.name = 'PlanStoppedError'; }
}

/**
 * Resolves with the ranked candidates and notes; rejects on failure (PlanUnreachableError when the
 * planner found no candidate), when the time budget runs out, or with
 * PlanStoppedError when `signal` aborts (the thread is terminated: the only way to stop synchronous code).
 */
export function runPlannerThread(input: PlannerThreadInput, onProgress: PlanProgress, timeBudgetMs = PLAN_TIME_BUDGET_MS, signal?: AbortSignal): Promise<PlannerThreadResult> {
  if (signal?.aborted) return Promise.reject(new PlanStoppedError());
  return new Promise((resolve, reject) => {
    const worker = new Worker(ENTRY, { workerData: input });
    let settled = false;
    const onAbort = () => finish(() => reject(new PlanStoppedError()));
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      signal?.removeEventListener('abort', onAbort);
      fn();
      void worker.terminate();
    };
    signal?.addEventListener('abort', onAbort, { once: true });
    const timer = setTimeout(() => finish(() => reject(new Error(`planning exceeded its time budget of ${timeBudgetMs / 1000} s`))), timeBudgetMs);
    worker.on('message', (m: PlannerThreadMessage) => {
      if (m.kind === 'progress') onProgress(m.fraction, m.note);
      else if (m.kind === 'done') finish(() => resolve({ candidates: m.candidates, notes: m.notes }));
      else finish(() => reject(m.notes?.length ? new PlanUnreachableError(m.message, m.notes) : new Error(m.message)));
    });
    worker.on('error', (err) => finish(() => reject(err)));
    worker.on('exit', (code) => finish(() => reject(new Error(`planner thread exited (code ${code}) without a result`))));
  });
}
