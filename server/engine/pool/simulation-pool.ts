/**
 * A small worker-thread pool for simulations: runs them off the request thread, one job per
 * worker at a time, with a per-job time budget. A job over budget gets its worker terminated
 * (the only way to stop synchronous code) and a SimulationTimeoutError; a fresh worker replaces it.
 */
import { cpus } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';

import type { PoolReply, PoolRequest, WorkerReady } from './messages.ts';

/** Thrown when a simulation exceeds its time budget. */
export class SimulationTimeoutError extends Error {
  constructor(readonly budgetMs: number) {
    super(`simulation exceeded its time budget of ${budgetMs} ms and was stopped; shorten the sequence or loosen rtol`);
    this.name = 'SimulationTimeoutError';
  }
}

/** Thrown when a worker dies or the engine fails internally. */
export class SimulationFailedError extends Error {
  constructor(message: string) { super(message); this.name = 'SimulationFailedError'; }
}

/** Pool settings. */
export interface PoolOptions {
  /** Number of worker threads (default: min(2, CPU count)). */
  size?: number;
  /** Time budget per job, ms (SIMULATION_TIMEOUT_MS in the product). */
  timeoutMs: number;
}

interface Job {
  request: PoolRequest;
  resolve: (r: Exclude<PoolReply, { kind: 'failed' }>) => void;
  reject: (e: Error) => void;
}

interface Slot { worker: Worker; job: Job | null; timer: NodeJS.Timeout | null; ready: boolean }

const ENTRY = fileURLToPath(new URL('./worker-entry.mjs', import.meta.url).href);

/** The pool. Create once, `run` many times, `close` at shutdown. */
export class SimulationPool {
  readonly size: number;
  readonly timeoutMs: number;
  private slots: Slot[] = [];
  private queue: Job[] = [];
  private nextId = 1;
  private closed = false;

  constructor(opts: PoolOptions) {
    this.size = Math.max(1, opts.size ?? Math.min(2, cpus().length));
    this.timeoutMs = opts.timeoutMs;
  }

  /** Jobs waiting for a worker. */
  get queued(): number {
    return this.queue.length;
  }

  /** Jobs running on a worker. */
  get running(): number {
    return this.slots.filter((s) => s.job).length;
  }

  /** Runs one simulation; resolves with the result or the contract issues, rejects on timeout or failure. */
  run(body: unknown, sequence: unknown, options: PoolRequest['options'] = {}): Promise<Exclude<PoolReply, { kind: 'failed' }>> {
    if (this.closed) return Promise.reject(new SimulationFailedError('simulation pool is closed'));
    return new Promise((resolve, reject) => {
      this.queue.push({ request: { id: this.nextId++, body, sequence, options }, resolve, reject });
      this.dispatch();
    });
  }

  /** Terminates all workers; queued jobs are rejected. */
  async close(): Promise<void> {
    this.closed = true;
    for (const j of this.queue.splice(0)) j.reject(new SimulationFailedError('simulation pool is closed'));
    await Promise.all(this.slots.map((s) => { if (s.timer) clearTimeout(s.timer); s.job?.reject(new SimulationFailedError('simulation pool is closed')); return s.worker.terminate(); }));
    this.slots = [];
  }

  private dispatch(): void {
    while (this.queue.length) {
      let slot = this.slots.find((s) => !s.job);
      if (!slot && this.slots.length < this.size) slot = this.spawn();
      if (!slot) return;
      const job = this.queue.shift()!;
      slot.job = job;
      // A new worker buffers the job until its engine has loaded; the budget starts once it is ready.
      if (slot.ready) this.startBudget(slot);
      slot.worker.postMessage(job.request);
    }
  }

  private spawn(): Slot {
    const worker = new Worker(ENTRY);
    const slot: Slot = { worker, job: null, timer: null, ready: false };
    worker.on('message', (reply: PoolReply | WorkerReady) => {
      if (reply.kind === 'ready') {
        slot.ready = true;
        if (slot.job) this.startBudget(slot);
        return;
      }
      const job = slot.job;
      if (!job || job.request.id !== reply.id) return;
      this.finish(slot);
      if (reply.kind === 'failed') job.reject(new SimulationFailedError(reply.message));
      else job.resolve(reply);
      this.dispatch();
    });
    worker.on('error', (err) => this.crash(slot, err instanceof Error ? err.message : String(err)));
    worker.on('exit', (code) => { if (slot.job) this.crash(slot, `simulation worker exited with code ${code}`); });
    // Idle workers must not keep the process alive.
    worker.unref();
    this.slots.push(slot);
    return slot;
  }

  private startBudget(slot: Slot): void {
    const s = slot;
    s.timer = setTimeout(() => this.timeout(s), this.timeoutMs);
  }

  private finish(slot: Slot): void {
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    slot.job = null;
  }

  private remove(slot: Slot): void {
    this.slots = this.slots.filter((s) => s !== slot);
  }

  private timeout(slot: Slot): void {
    const job = slot.job;
    this.finish(slot);
    this.remove(slot);
    void slot.worker.terminate();
    job?.reject(new SimulationTimeoutError(this.timeoutMs));
    this.dispatch();
  }

  private crash(slot: Slot, message: string): void {
    const job = slot.job;
    this.finish(slot);
    this.remove(slot);
    void slot.worker.terminate();
    job?.reject(new SimulationFailedError(message));
    this.dispatch();
  }
}
