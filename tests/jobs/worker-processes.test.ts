/**
 * Worker processes that die: a worker killed with SIGKILL mid-job has its job retried by another
 * worker process, which completes it once; a plan whose worker died ends `done` (retried) and never
 * stays `running`; a plan whose retries ran out is failed with a reason by the reconciliation.
 * Heartbeat 10 s (pg-boss's minimum), supervisor every second, polling every half second.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import { and, eq } from 'drizzle-orm';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';

import { auditEvents, plans, robustnessChunks, robustnessRuns } from '../../db/schema/index.ts';
import { PLAN_QUEUE, ROBUSTNESS_CHUNK_QUEUE } from '../../server/jobs/queue-names.ts';
import { reconcileWork } from '../../server/jobs/reconcile-work.ts';
import { queueVersionRobustness } from '../../server/jobs/robustness/version-robustness.ts';
import type { Plan } from '../../shared/contracts/plan.ts';
import { as, crewOf, draftedVersion, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { createQuarterTurnSequence } from '../planning/quarter-turn-sequence.ts';
import { eventually } from '../support/eventually.ts';
import { bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
// This process only sends jobs (like the API process); the workers are separate processes.
const t = testAppForFile({ env: { ROBUSTNESS_SAMPLES: '10', ROBUSTNESS_CHUNK_SIZE: '10' }, jobQueue: { worker: false, reconcile: false } });
let versionId: string;
const children: ChildProcess[] = [];

/** Starts `npm run worker`'s script as a separate process on the test database; resolves once it is ready. */
async function startWorker(name: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/scripts/worker.ts')], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: t.ctx.config.DATABASE_URL,
      JWT_SECRET: t.ctx.config.JWT_SECRET,
      LOG_LEVEL: 'silent',
      WORKER_NAME: name,
      WORKER_CONCURRENCY: '1',
      JOB_HEARTBEAT_SECONDS: '10',
      JOB_SUPERVISE_SECONDS: '1',
      JOB_POLL_SECONDS: '0.5',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  let out = '';
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${name} not ready in 60 s: ${out}`)), 60_000);
    const onData = (d: Buffer) => {
      out += d.toString();
      if (out.includes('Ready:')) { clearTimeout(timer); resolve(); }
    };
    child.stdout.on('data', onData);
    child.stderr.on('data', onData);
    child.on('exit', (code) => { clearTimeout(timer); reject(new Error(`${name} exited (${code}): ${out}`)); });
  });
  return child;
}

function kill(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    child.once('exit', () => resolve());
    child.kill('SIGKILL');
  });
}

const runRow = async (id: string) => (await t.ctx.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, id)))[0];
const planRow = async (id: string) => (await t.ctx.db.select().from(plans).where(eq(plans.id, id)))[0];

/** The record once its work has ended (done or failed): what the surviving worker made of it. */
function whenEnded<R extends { state: string }>(read: () => Promise<R>): Promise<R> {
  return eventually(async () => {
    const r = await read();
    return r.state === 'done' || r.state === 'failed' ? r : undefined;
  }, 120_000, 250);
}

beforeAll(async () => {
  versionId = await draftedVersion(t, await crewOf(t, PEOPLE.trainee), 'Worker kill test');
});
afterEach(async () => {
  await Promise.all(children.splice(0).map(kill));
});

describe('worker processes', () => {
  const SAMPLES = 10_000;
  it('a chunk held by a worker killed with SIGKILL is retried by another worker and completes once', async () => {
    const first = await startWorker('worker A');
    // One long chunk (10,000 samples, several seconds of work even on a fast engine), killed as soon as
    // the worker has marked it running, so the kill lands mid-job however fast the engine gets.
    const runId = await queueVersionRobustness(t.ctx, versionId, { samples: SAMPLES, chunkSize: SAMPLES });
    await eventually(async () => {
      const [c] = await t.ctx.db.select().from(robustnessChunks).where(eq(robustnessChunks.runId, runId));
      return c.state === 'running' ? true : undefined;
    }, 60_000, 50);
    await kill(first);
    const killedAt = Date.now();
    expect((await runRow(runId)).state).toBe('running');

    await startWorker('worker B');
    const run = await whenEnded(() => runRow(runId));
    expect(run.error).toBeNull();
    expect(run.state).toBe('done');
    expect(run.doneSamples).toBe(SAMPLES);
    // Retried within the minute the product promises (the retry's own computation is on top).
    const [chunk] = await t.ctx.db.select().from(robustnessChunks).where(eq(robustnessChunks.runId, runId));
    expect(chunk.attempts).toBe(2);
    const [job] = await t.jobs.boss.findJobs(ROBUSTNESS_CHUNK_QUEUE, { data: { runId } });
    expect(job.state).toBe('completed');
    expect(job.retryCount).toBe(1);
    expect(+job.startedOn - killedAt).toBeLessThan(60_000);
    // Exactly one result.
    const done = await t.ctx.db.select().from(auditEvents).where(and(eq(auditEvents.action, 'robustness.done'), eq(auditEvents.objectId, versionId)));
    expect(done.filter((e) => (e.detail as { runId: string }).runId === runId)).toHaveLength(1);
  }, 180_000);

  it('a plan whose worker died is retried by another worker and ends done, never left running', async () => {
    const sequenceId = await createQuarterTurnSequence(t, 'Quarter turn (worker kill)');
    const first = await startWorker('worker C');
    const res = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, { samples: 20, maxCandidates: 3 });
    expect(res.status).toBe(202);
    const { planId } = res.body as { planId: string };
    await eventually(async () => {
      const p = await planRow(planId);
      return p.state !== 'queued' ? p : undefined;
    }, 60_000, 20);
    await kill(first);
    // The plan was cut off mid-run (a plan takes seconds; the kill follows its start within ~20 ms).
    expect((await planRow(planId)).state).toBe('running');

    await startWorker('worker D');
    const plan = await whenEnded(() => planRow(planId));
    expect(plan.error).toBeNull();
    expect(plan.state).toBe('done');
    expect((plan.candidates as unknown[]).length).toBeGreaterThan(0);
    const events = await t.ctx.db.select().from(auditEvents).where(and(eq(auditEvents.objectId, planId), eq(auditEvents.action, 'plan.done')));
    expect(events).toHaveLength(1);
  }, 180_000);

  it('a plan whose job ran out of retries is failed with a reason, not left running', async () => {
    const sequenceId = await createQuarterTurnSequence(t, 'Quarter turn (retries out)');
    const res = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/plans`, { samples: 20, maxCandidates: 3 });
    const { planId } = res.body as { planId: string };
    // Stand in for workers that died on every attempt: claim the job, mark the plan running, fail the job for good.
    const [job] = await t.jobs.boss.findJobs(PLAN_QUEUE, { data: { planId } });
    await t.jobs.boss.deleteJob(PLAN_QUEUE, job.id);
    await t.jobs.boss.send(PLAN_QUEUE, { planId }, { retryLimit: 0 });
    const [claimed] = await t.jobs.boss.fetch(PLAN_QUEUE);
    await t.ctx.db.update(plans).set({ state: 'running', createdAt: new Date(Date.now() - 60_000) }).where(eq(plans.id, planId));
    await t.jobs.boss.fail(PLAN_QUEUE, claimed.id, { message: 'heartbeat lost' });

    const result = await reconcileWork(t.ctx, t.jobs);
    expect(result.failed).toBeGreaterThanOrEqual(1);
    const [plan] = await t.ctx.db.select().from(plans).where(eq(plans.id, planId));
    expect(plan.state).toBe('failed');
    expect(plan.error).toMatch(/Planning did not finish: the worker running it stopped or failed once \(heartbeat lost\)/);
    // The API shows the reason.
    const shown = await as(t, PEOPLE.planner).get(`/sequences/${sequenceId}/plans/${planId}`);
    expect(bodyOf<Plan>(shown).state).toBe('failed');
    expect(bodyOf<Plan>(shown).error).toBe(plan.error);
  }, 60_000);
});
