/**
 * An engine change (DECISIONS.md "An engine change"): on start, cleared versions verified by another
 * engine version are re-verified in the background. The engine is injected through the app context:
 * the real engine's result relabelled with a newer engine version, its final attitude turned by a
 * chosen angle about the body z axis. Within 1e-6 rad (the threshold DECISIONS.md sets) and with every
 * limit check the same, the record says "re-verified under engine X, unchanged" and the approval
 * stands; beyond it, the version becomes stale and its re-check version waits for the reviewer.
 */
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { sequenceVersions } from '../../db/schema/index.ts';
import type { SimulationPool } from '../../server/engine/pool/simulation-pool.ts';
import { reverifyVersion } from '../../server/jobs/reverify-version.ts';
import { compareUnderEngine, queueEngineRechecks } from '../../server/maneuvers/engine-recheck.ts';
import type { ReviewQueueItem, VerificationReport, VersionDetail } from '../../shared/contracts/maneuver.ts';
import type { RehearsableVersion } from '../../shared/contracts/rehearsal.ts';
import { recheckMessage } from '../../shared/product/recheck-status.ts';
import { bodyOf } from '../support/response-body.ts';
import { startTestApp, type TestApp } from '../support/test-app.ts';
import { as, clearedVersion, crewOf, PEOPLE } from './maneuver-api.ts';

const NEXT_ENGINE = '9.9.9+test-next';

let t: TestApp;
let crew: string;
let realEngine: SimulationPool;
beforeAll(async () => {
  t = await startTestApp({ env: { ROBUSTNESS_SAMPLES: '20', ROBUSTNESS_CHUNK_SIZE: '10' } });
  crew = await crewOf(t, PEOPLE.trainee);
  realEngine = t.ctx.simulation.product;
}, 120_000);
afterAll(async () => {
  await t?.close();
});

/** The next engine: the real one's result under NEXT_ENGINE, its final attitude turned by `turnRad` about body z. */
function nextEngine(turnRad: number): SimulationPool {
  const run: SimulationPool['run'] = async (...args) => {
    const reply = await realEngine.run(...args);
    if (reply.kind !== 'result') return reply;
    const { w, x, y, z } = reply.result.final.attitude;
    // q ⊗ (cos θ/2, 0, 0, sin θ/2): a turn about the body's z axis.
    const c = Math.cos(turnRad / 2), s = Math.sin(turnRad / 2);
    const attitude = { w: w * c - z * s, x: x * c + y * s, y: y * c - x * s, z: z * c + w * s };
    return { ...reply, result: { ...reply.result, engineVersion: NEXT_ENGINE, final: { ...reply.result.final, attitude } } };
  };
  return { run } as unknown as SimulationPool;
}

const detail = async (id: string) => bodyOf<VersionDetail>(await as(t, PEOPLE.planner).get(`/sequences/versions/${id}`));

describe('an engine change on cleared maneuvers', () => {
  it('re-verifies cleared versions of another engine once; unchanged within 1e-6 rad keeps the approval, a moved result goes to the reviewer as a re-check', async () => {
    const a = await detail(await clearedVersion(t, crew, 'Engine A'));
    const b = await detail(await clearedVersion(t, crew, 'Engine B'));
    expect(a.engineVersion).not.toBe(NEXT_ENGINE);

    // Start under the next engine: every cleared version (the demo's too) is queued, once.
    t.ctx.engineVersion = NEXT_ENGINE;
    const queued = await queueEngineRechecks(t.ctx);
    expect(queued).toEqual(expect.arrayContaining([a.id, b.id]));
    expect(await queueEngineRechecks(t.ctx)).toEqual([]);

    // A: the result moved 5e-7 rad, under the 1e-6 rad threshold → unchanged, approval stands.
    t.ctx.simulation = { ...t.ctx.simulation, product: nextEngine(5e-7) };
    await reverifyVersion(t.ctx, { sequenceVersionId: a.id, toProfileVersionId: a.profileVersionId }, { attempt: 0, retryLimit: 0 });
    const aAfter = await detail(a.id);
    expect(aAfter.status).toBe('cleared');
    expect(aAfter.reverifications[0]).toMatchObject({ state: 'done', engineVersion: NEXT_ENGINE });
    expect(aAfter.reverifications[0].outcome).toMatch(new RegExp(`^Re-verified under engine ${NEXT_ENGINE.replace(/[.+]/g, '\\$&')}, unchanged .*the approval stands\\.$`));
    expect((await as(t, PEOPLE.trainee).get(`/motion/${a.id}`)).status).toBe(200);
    const aRows = await t.ctx.db.select({ id: sequenceVersions.id }).from(sequenceVersions).where(eq(sequenceVersions.sequenceId, a.sequenceId));
    expect(aRows).toHaveLength(1);

    // B: the result moved 1e-4 rad → stale, and the next version waits for the reviewer with the new report.
    t.ctx.simulation = { ...t.ctx.simulation, product: nextEngine(1e-4) };
    await reverifyVersion(t.ctx, { sequenceVersionId: b.id, toProfileVersionId: b.profileVersionId }, { attempt: 0, retryLimit: 0 });
    const bAfter = await detail(b.id);
    expect(bAfter.status).toBe('recheck');
    expect(bAfter.reverifications[0].outcome).toMatch(/^Re-verified under engine .*: final attitude moved 1\.00e-4 rad\. Version 2 waits for a reviewer's re-check\.$/);
    const [next] = await t.ctx.db.select().from(sequenceVersions).where(eq(sequenceVersions.recheckOfId, b.id));
    expect(next).toMatchObject({ status: 'under_review', version: 2, authorId: null, profileVersionId: b.profileVersionId, engineVersion: NEXT_ENGINE });
    expect(next.note).toMatch(/after an engine change/);
    expect((next.report as VerificationReport).engineVersion).toBe(NEXT_ENGINE);
    const queue = bodyOf<{ items: ReviewQueueItem[] }>(await as(t, PEOPLE.reviewer).get('/reviews/queue')).items;
    expect(queue.find((i) => i.version.id === next.id)?.version.recheckOfId).toBe(b.id);
    // The trainee reads why, truthfully: an engine update, not a profile change.
    const listed = bodyOf<{ versions: RehearsableVersion[] }>(await as(t, PEOPLE.trainee).get('/rehearsals/available')).versions.find((v) => v.versionId === b.id)!;
    expect(listed.recheck!.cause).toBe('engine');
    expect(recheckMessage(listed.recheck!)).toMatch(/^The simulation engine was updated and re-verifying this maneuver changed its result \(attitude moved 0\.01°\); version 2 is waiting for your reviewer\./);

    // Next start: A is done under this engine, B is no longer cleared — nothing new is queued for them.
    expect(await queueEngineRechecks(t.ctx)).not.toEqual(expect.arrayContaining([a.id]));
    expect(await queueEngineRechecks(t.ctx)).not.toContain(b.id);
  }, 300_000);

  it('counts a changed limit check as a change even when the attitude agrees', () => {
    const base = { final: { attitude: { w: 1, x: 0, y: 0, z: 0 } }, target: { withinTolerance: true }, peakJointRate: { withinLimit: true }, timeBudget: { within: true }, rangeViolations: [] } as unknown as VerificationReport;
    expect(compareUnderEngine(base, base)).toEqual({ unchanged: true, shiftRad: 0, changedChecks: [] });
    const over = { ...base, peakJointRate: { withinLimit: false } } as unknown as VerificationReport;
    expect(compareUnderEngine(base, over)).toMatchObject({ unchanged: false, changedChecks: ['joint rate now over its limit'] });
    const violation = { ...base, rangeViolations: [{ dof: 'r_sh_flex', bound: 'max', step: 1 }] } as unknown as VerificationReport;
    expect(compareUnderEngine(base, violation)).toMatchObject({ unchanged: false, changedChecks: ['new range violation: r_sh_flex max in step 2'] });
  });
});
