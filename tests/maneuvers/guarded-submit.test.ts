/**
 * Guarded submit (DECISIONS.md): a version that misses its target, leaves a joint range, exceeds the
 * rate limit or time budget, or whose robustness is not computed is refused with every reason,
 * unless submitted with `acknowledgeFailures` and a note, which the reviewer then sees with the
 * failures. The checks' wording is shared by the server's refusal and the screens.
 */
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';

import { auditEvents, sequenceVersions } from '../../db/schema/index.ts';
import type { ReviewQueueItem, VerificationReport, VersionDetail } from '../../shared/contracts/maneuver.ts';
import type { RobustnessRun } from '../../shared/contracts/robustness-run.ts';
import { failuresSentence, type ReportForChecks,versionCheckFailures } from '../../shared/product/version-checks.ts';
import { eventually } from '../support/eventually.ts';
import { apiError, bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, createSequence, crewOf, PEOPLE, saveVersion,THREE_STEPS } from './maneuver-api.ts';

// Response bodies as the web client reads them.
type ItemsBody = { items: ReviewQueueItem[] };

/** A report that passes every check (figures invented for the unit tests). */
const passing: ReportForChecks = {
  durationS: 20,
  target: { attitude: { w: 1, x: 0, y: 0, z: 0 }, errorDeg: 0.5, toleranceDeg: 2, withinTolerance: true },
  rangeViolations: [],
  peakJointRate: { maxDegS: 120, dof: 'r_sh_flex', time: 3, limitDegS: 180, withinLimit: true, byDof: {} },
  timeBudget: { limitS: 30, within: true },
};
const done = { state: 'done' as const, progress: 1 };

describe('the checks (pure)', () => {
  it('a report within every limit with a finished robustness run passes', () => {
    expect(versionCheckFailures(passing, done)).toEqual([]);
    expect(failuresSentence([])).toBe('Passes every check.');
  });

  it('no report fails on its own', () => {
    expect(versionCheckFailures(null, done).map((f) => f.check)).toEqual(['report']);
  });

  it('a target missed by 139.3° against 2° is named with both figures', () => {
    const r = { ...passing, target: { ...passing.target, errorDeg: 139.3, withinTolerance: false } };
    expect(versionCheckFailures(r, done)).toEqual([{ check: 'target', message: 'it misses its target by 139.3° (tolerance 2.0°)' }]);
  });

  it('range violations name the joints and the worst margin', () => {
    const v = { step: 1, bound: 'max' as const, limitDeg: 180, from: 1, to: 2, worstAngleDeg: 185 };
    const r = { ...passing, rangeViolations: [{ ...v, dof: 'r_sh_flex', worstTime: 1.5, marginDeg: 5 }, { ...v, dof: 'l_sh_flex', worstTime: 4.25, marginDeg: 7.5 }] };
    const [f] = versionCheckFailures(r, done);
    expect(f.check).toBe('ranges');
    expect(f.message).toBe('it leaves the joint range 2 times (r_sh_flex, l_sh_flex; worst l_sh_flex 7.5° beyond its maximum at 4.3 s)');
  });

  it('a peak rate over the limit and a duration over the budget each fail', () => {
    const r = { ...passing, durationS: 31, peakJointRate: { ...passing.peakJointRate, maxDegS: 181, withinLimit: false }, timeBudget: { limitS: 30, within: false } };
    expect(versionCheckFailures(r, done).map((f) => f.message)).toEqual([
      'its peak joint rate 181 °/s (r_sh_flex) exceeds the 180 °/s limit',
      'it takes 31.0 s, over its 30 s time budget',
    ]);
  });

  it('robustness fails unless the run is done: none, queued, running, failed', () => {
    expect(versionCheckFailures(passing, null)[0].message).toMatch(/not been computed/);
    expect(versionCheckFailures(passing, { state: 'running', progress: 0.4 })[0].message).toBe('its robustness is not computed yet (run running, 40 %)');
    expect(versionCheckFailures(passing, { state: 'queued', progress: 0 })[0].check).toBe('robustness');
    expect(versionCheckFailures(passing, { state: 'failed', progress: 0.2, error: 'worker died' })[0].message).toMatch(/failed \(worker died\)/);
  });
});

// Small robustness runs: the run's figures are not under test, only whether one finished.
const t = testAppForFile({ env: { ROBUSTNESS_SAMPLES: '20', ROBUSTNESS_CHUNK_SIZE: '10' } });
let crew: string;
beforeAll(async () => {
  crew = await crewOf(t, PEOPLE.trainee);
});

const submit = (id: string, body: object = {}, by: string = PEOPLE.planner) => as(t, by).post(`/sequences/versions/${id}/submit`, body);

describe('POST …/submit', () => {
  it('refuses a version that misses its target with the reason; a note alone or the flag alone is not enough; both go through and the reviewer sees them', async () => {
    const sequenceId = await createSequence(t, crew, 'Guarded miss');
    // Small arm loops cannot turn the body half round: the version misses a yaw-180 target.
    const saved = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/versions`, {
      primitives: THREE_STEPS, baseVersion: 0, target: { mode: 'ypr', yprDeg: { yaw: 180, pitch: 0, roll: 0 }, toleranceDeg: 2 },
    });
    expect(saved.status).toBe(201);
    const id = bodyOf<VersionDetail>(saved).id;
    const report = bodyOf<VersionDetail>(saved).report as VerificationReport;
    expect(report.target.withinTolerance).toBe(false);

    const bare = await submit(id);
    expect(bare.status).toBe(409);
    expect(apiError(bare).code).toBe('checks_failed');
    expect(apiError(bare).field).toBe('acknowledgeFailures');
    expect(apiError(bare).message).toContain(`misses its target by ${report.target.errorDeg.toFixed(1)}°`);
    expect(apiError(bare).message).toMatch(/robustness is not computed yet/);
    expect((await submit(id, { note: 'please look' })).status).toBe(409);
    const noNote = await submit(id, { acknowledgeFailures: true, note: '   ' });
    expect(noNote.status).toBe(409);
    expect(apiError(noNote).field).toBe('note');
    // Nothing moved on a refusal.
    const [still] = await t.ctx.db.select({ s: sequenceVersions.status }).from(sequenceVersions).where(eq(sequenceVersions.id, id));
    expect(still.s).toBe('drafting');

    const ok = await submit(id, { acknowledgeFailures: true, note: 'Target is a placeholder; judge the arm loops.' });
    expect(ok.status).toBe(200);
    expect(bodyOf<VersionDetail>(ok).status).toBe('under_review');
    const seen = await as(t, PEOPLE.reviewer).get(`/sequences/versions/${id}`);
    expect(bodyOf<VersionDetail>(seen).submitNote).toBe('Target is a placeholder; judge the arm loops.');
    expect(bodyOf<VersionDetail>(seen).acknowledgedFailures?.map((f) => f.check)).toEqual(['target', 'robustness']);
    const queue = await as(t, PEOPLE.reviewer).get('/reviews/queue');
    const item = bodyOf<ItemsBody>(queue).items.find((i) => i.version.id === id)!;
    expect(item.version.acknowledgedFailures).toHaveLength(2);
    const audit = await t.ctx.db.select().from(auditEvents).where(eq(auditEvents.objectId, id));
    expect(audit.find((a) => a.action === 'sequence_version.submit')?.detail).toMatchObject({ acknowledgedFailures: ['target', 'robustness'] });
  }, 60_000);

  it('a version on target goes only once its robustness run is done, then without a note', async () => {
    const sequenceId = await createSequence(t, crew, 'Guarded pass');
    const first = await saveVersion(t, sequenceId, 0);
    const reached = (bodyOf<VersionDetail>(first).report as VerificationReport).final.yprDeg;
    // The same steps for the attitude they reach: version 2 meets its own target.
    const second = await as(t, PEOPLE.planner).post(`/sequences/${sequenceId}/versions`, {
      primitives: bodyOf<VersionDetail>(first).primitives, baseVersion: 1, target: { mode: 'ypr', yprDeg: reached, toleranceDeg: 1 },
    });
    expect(second.status).toBe(201);
    const id = bodyOf<VersionDetail>(second).id;
    expect(bodyOf<VersionDetail>(second).report!.target.withinTolerance).toBe(true);
    expect(bodyOf<VersionDetail>(second).report!.peakJointRate.withinLimit).toBe(true);
    expect(bodyOf<VersionDetail>(second).report!.rangeViolations).toEqual([]);

    // No worker yet: the run waits, and the submit says so and nothing else.
    const waiting = await submit(id);
    expect(waiting.status).toBe(409);
    expect(apiError(waiting).message).toMatch(/^Version 2: Fails 1 check: its robustness is not computed yet \(run queued, 0 %\)\./);

    await t.startJobQueue({ pollingIntervalS: 0.5, superviseS: 1 });
    await eventually(async () => {
      const r = await as(t, PEOPLE.planner).get(`/sequences/versions/${id}/robustness`);
      return bodyOf<RobustnessRun>(r).state === 'done' ? true : undefined;
    }, 90_000);
    const ok = await submit(id);
    expect(ok.status).toBe(200);
    expect(bodyOf<VersionDetail>(ok).acknowledgedFailures).toBeNull();
    expect(bodyOf<VersionDetail>(ok).submitNote).toBeNull();
  }, 120_000);
});
