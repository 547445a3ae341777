/**
 * CPU time of other processes for the benchmarks, read from Linux's /proc (utime + stime of
 * /proc/<pid>/stat, in clock ticks of 1/100 s): a worker process's CPU during a run, and the whole
 * PostgreSQL cluster's (the postmaster and every backend it forked), so the bench can show what the
 * queue costs in CPU as well as in wall time on a shared machine where wall time is unreliable.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

/** Clock ticks per second of /proc's times (USER_HZ, 100 on Linux). */
const TICKS_PER_S = 100;

/** [ppid, own cpu seconds, cpu seconds of its children that exited] of a process or thread, or null once it is gone. */
function statOf(file: string): [number, number, number] | null {
  try {
    const stat = readFileSync(file, 'utf8');
    // The command name (field 2) may hold spaces: the fields after its closing parenthesis are fixed.
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ').map(Number);
    return [f[1], (f[11] + f[12]) / TICKS_PER_S, (f[13] + f[14]) / TICKS_PER_S];
  } catch {
    return null;
  }
}

/** CPU seconds (user + system) a process has used so far, all its threads; NaN once it is gone. */
export function processCpuS(pid: number): number {
  return statOf(`/proc/${pid}/stat`)?.[1] ?? NaN;
}

/**
 * CPU seconds of a Node process's main thread (its event loop: for a worker, the queue, the
 * database client and the merging), without its compute threads.
 */
export function mainThreadCpuS(pid: number): number {
  return statOf(`/proc/${pid}/task/${pid}/stat`)?.[1] ?? NaN;
}

/**
 * CPU seconds used so far by a PostgreSQL cluster: its postmaster (first line of postmaster.pid in
 * the data folder), its children alive now and those that exited (counted in the postmaster's
 * children's time once it has reaped them).
 */
export function clusterCpuS(dataDir: string): number {
  const postmaster = Number(readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
  const own = statOf(`/proc/${postmaster}/stat`);
  if (!own) return NaN;
  // Backends that exited (an idle pool connection closing) left their time in the postmaster's children's total.
  let total = own[1] + own[2];
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    const s = statOf(`/proc/${entry}/stat`);
    if (s && s[0] === postmaster) total += s[1];
  }
  return total;
}

/** CPU seconds used so far by each thread of a process, by thread id (threads that exited are not listed). */
export function threadCpuS(pid: number): Map<number, number> {
  const out = new Map<number, number>();
  let tids: string[];
  try {
    tids = readdirSync(`/proc/${pid}/task`);
  } catch {
    return out;
  }
  for (const tid of tids) {
    const s = statOf(`/proc/${pid}/task/${tid}/stat`);
    if (s) out.set(Number(tid), s[1]);
  }
  return out;
}
