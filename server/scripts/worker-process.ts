/**
 * A worker process started by `npm start` (server/scripts/worker.ts as a child process), restarted
 * when it dies unexpectedly (a worker killed outright loses nothing: its jobs are retried), and
 * stopped with SIGTERM when the product stops.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import path from 'node:path';

/** A supervised worker child. */
export interface WorkerProcess {
  readonly pid: () => number | undefined;
  stop(): Promise<void>;
}

/** Starts `server/scripts/worker.ts` with `env`; logs through `log`. */
export function startWorkerProcess(root: string, env: NodeJS.ProcessEnv, opts: { name: string; log: (s: string) => void }): WorkerProcess {
  let child: ChildProcess | null = null;
  let stopping = false;
  let quickExits = 0;
  const launch = () => {
    const startedAt = Date.now();
    const c = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/scripts/worker.ts')], {
      cwd: root, env: { ...env, WORKER_NAME: opts.name }, stdio: ['ignore', 'inherit', 'inherit'],
    });
    child = c;
    opts.log(`Worker process "${opts.name}" started (pid ${c.pid}).`);
    c.on('exit', (code, signal) => {
      if (child === c) child = null;
      if (stopping) return;
      quickExits = Date.now() - startedAt < 10_000 ? quickExits + 1 : 0;
      if (quickExits >= 3) {
        opts.log(`Worker process "${opts.name}" keeps stopping at start (exit ${code ?? signal}); not restarting it. Jobs wait in the queue until a worker runs.`);
        return;
      }
      opts.log(`Worker process "${opts.name}" stopped (${signal ?? `exit ${code}`}); starting a new one in 2 s. Its jobs are retried.`);
      setTimeout(() => { if (!stopping) launch(); }, 2000).unref();
    });
  };
  launch();
  return {
    pid: () => child?.pid,
    stop: async () => {
      stopping = true;
      const c = child;
      if (!c || c.exitCode !== null) return;
      await new Promise<void>((resolve) => {
        const kill = setTimeout(() => c.kill('SIGKILL'), 15_000);
        c.once('exit', () => { clearTimeout(kill); resolve(); });
        c.kill('SIGTERM');
      });
    },
  };
}
