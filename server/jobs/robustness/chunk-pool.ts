/**
 * Long-lived worker threads that compute robustness chunks, one chunk per thread at a time, so the
 * worker process's event loop stays free for job heartbeats and cancel checks. A chunk that is
 * aborted (its run was cancelled) gets its thread terminated — the only way to stop synchronous
 * code — and a fresh thread replaces it on the next chunk. A thread keeps the inputs of the run it
 * last worked on, so a run's further chunks send only their sample range.
 */
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';

import type { RobustnessSample } from '../../../shared/contracts/robustness-stored.ts';
import type { RobustnessInputs } from '../../planning/robustness.ts';
import type { ChunkReply, ChunkRequest, ChunkThreadReady } from './chunk-messages.ts';

const ENTRY = fileURLToPath(new URL('./chunk-entry.mjs', import.meta.url).href);

/** Thrown when a chunk was stopped through its AbortSignal. */
export class ChunkAbortedError extends Error {
  constructor() { super('chunk stopped'); this.name = 'ChunkAbortedError'; }
}

/** A computed chunk: its samples and the thread's wall time computing them. */
export interface ChunkResult { samples: RobustnessSample[]; computeMs: number }

interface Pending { request: ChunkRequest; inputs: RobustnessInputs; resolve: (r: ChunkResult) => void; reject: (e: Error) => void; signal?: AbortSignal; onAbort?: () => void }
/** `key`: the run whose inputs the thread holds. */
interface Slot { worker: Worker; job: Pending | null; ready: Promise<void>; key: string | null }

export class ChunkPool {
  private slots: Slot[] = [];
  private queue: Pending[] = [];
  private nextId = 1;
  private closed = false;

  constructor(readonly size: number) {}

  /** Computes samples [from, to) of `inputs` in a thread; `key` names the inputs (a run id: same key, same inputs). */
  run(key: string, inputs: RobustnessInputs, from: number, to: number, signal?: AbortSignal): Promise<ChunkResult> {
    if (this.closed) return Promise.reject(new Error('robustness thread pool is closed'));
    if (signal?.aborted) return Promise.reject(new ChunkAbortedError());
    return new Promise((resolve, reject) => {
      const job: Pending = { request: { id: this.nextId++, key, from, to }, inputs, resolve, reject, signal };
      job.onAbort = () => this.abort(job);
      signal?.addEventListener('abort', job.onAbort, { once: true });
      this.queue.push(job);
      this.dispatch();
    });
  }

  /** Starts every thread and waits until each has loaded the model (a worker process does this at start). */
  async warm(): Promise<void> {
    while (this.slots.length < this.size) this.spawn();
    await Promise.all(this.slots.map((s) => s.ready));
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const j of this.queue.splice(0)) this.settle(j, () => j.reject(new Error('robustness thread pool is closed')));
    await Promise.all(this.slots.map((s) => {
      if (s.job) { const j = s.job; this.settle(j, () => j.reject(new Error('robustness thread pool is closed'))); }
      return s.worker.terminate();
    }));
    this.slots = [];
  }

  private dispatch(): void {
    while (this.queue.length) {
      const free = this.slots.filter((s) => !s.job);
      // A thread that already holds this run's inputs is preferred.
      let slot = free.find((s) => s.key === this.queue[0].request.key) ?? free[0];
      if (!slot && this.slots.length < this.size) slot = this.spawn();
      if (!slot) return;
      const job = this.queue.shift()!;
      slot.job = job;
      const fresh = slot.key !== job.request.key;
      slot.key = job.request.key;
      slot.worker.postMessage(fresh ? { ...job.request, inputs: job.inputs } : job.request);
    }
  }

  private spawn(): Slot {
    const worker = new Worker(ENTRY);
    let markReady = () => {};
    const slot: Slot = { worker, job: null, key: null, ready: new Promise<void>((resolve) => { markReady = resolve; }) };
    worker.on('message', (reply: ChunkReply | ChunkThreadReady) => {
      if (reply.kind === 'ready') return markReady();
      const job = slot.job;
      if (!job || job.request.id !== reply.id) return;
      slot.job = null;
      if (reply.kind === 'done') this.settle(job, () => job.resolve({ samples: reply.samples, computeMs: reply.computeMs }));
      else this.settle(job, () => job.reject(new Error(reply.message)));
      this.dispatch();
    });
    const crash = (message: string) => {
      markReady();
      this.slots = this.slots.filter((s) => s !== slot);
      const job = slot.job;
      slot.job = null;
      if (job) this.settle(job, () => job.reject(new Error(message)));
      this.dispatch();
    };
    worker.on('error', (err) => crash(err instanceof Error ? err.message : String(err)));
    worker.on('exit', (code) => crash(`robustness thread exited with code ${code}`));
    worker.unref();
    this.slots.push(slot);
    return slot;
  }

  private abort(job: Pending): void {
    const queued = this.queue.indexOf(job);
    if (queued >= 0) this.queue.splice(queued, 1);
    const slot = this.slots.find((s) => s.job === job);
    if (slot) {
      slot.job = null;
      this.slots = this.slots.filter((s) => s !== slot);
      void slot.worker.terminate();
    }
    this.settle(job, () => job.reject(new ChunkAbortedError()));
    this.dispatch();
  }

  private settle(job: Pending, fn: () => void): void {
    if (job.onAbort) job.signal?.removeEventListener('abort', job.onAbort);
    job.onAbort = undefined;
    fn();
  }
}
