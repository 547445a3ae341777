/**
 * Re-check flags commit with the profile save that causes them (one transaction): a failure after
 * the save inside its transaction leaves neither the new profile nor any flag, and a failure after
 * the commit (the job queue refusing the re-verification jobs, or no queue at all) cannot leave an
 * approval unflagged — the flag and its queued re-verification record are already stored, and the
 * workers' reconcile pass sends the missing job.
 */
import { and, eq } from 'drizzle-orm';
import type { PgBoss } from 'pg-boss';
import { beforeAll, describe, expect, it } from 'vitest';

import { crewMembers, profileVersions, reverifications, sequenceVersions } from '../../db/schema/index.ts';
import type { JobQueue } from '../../server/app-context.ts';
import { appendProfileVersion } from '../../server/crew/append-profile-version.ts';
import { reconcileWork } from '../../server/jobs/reconcile-work.ts';
import type { ProfileVersionView } from '../../shared/contracts/profile-version.ts';
import { bodyOf } from '../support/response-body.ts';
import { testAppForFile } from '../support/test-app.ts';
import { as, clearedVersion, crewOf, PEOPLE } from './maneuver-api.ts';

// Response bodies as the web client reads them.
type VersionBody = { version: ProfileVersionView };

const t = testAppForFile();
let crew: string;
beforeAll(async () => {
  crew = await crewOf(t, PEOPLE.trainee);
});


async function currentVersion(): Promise<number> {
  const [m] = await t.ctx.db.select({ v: crewMembers.currentVersion }).from(crewMembers).where(eq(crewMembers.id, crew));
  return m.v!;
}

async function saveProfile(massKg: number) {
  return as(t, PEOPLE.planner).post(`/crew/${crew}/versions`, {
    baseVersion: await currentVersion(), note: 'mass drift (test)', inputs: { sex: 'female', stature: 1.67, mass: massKg, suitId: null },
  });
}

async function stateOf(versionId: string) {
  const [v] = await t.ctx.db.select({ status: sequenceVersions.status, staleSince: sequenceVersions.staleSince }).from(sequenceVersions).where(eq(sequenceVersions.id, versionId));
  const records = await t.ctx.db.select().from(reverifications).where(eq(reverifications.sequenceVersionId, versionId));
  return { ...v, records };
}

describe('re-check flags commit with the profile save', () => {
  it('a failure after the save, inside its transaction, rolls back the save and the flags together', async () => {
    const v = await clearedVersion(t, crew, 'Recheck rollback');
    const before = await currentVersion();
    const profilesBefore = (await t.ctx.db.select({ id: profileVersions.id }).from(profileVersions).where(eq(profileVersions.crewMemberId, crew))).length;
    // Injected failure: the audit event the save route writes after appending the profile version (and flagging) is refused.
    await t.pool.query(`CREATE FUNCTION test_fail_profile_audit() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN IF NEW.action = 'crew.save_profile' THEN RAISE EXCEPTION 'injected failure after the profile save' USING ERRCODE = 'XX000'; END IF; RETURN NEW; END $$`);
    await t.pool.query('CREATE TRIGGER test_fail_profile_audit BEFORE INSERT ON audit_events FOR EACH ROW EXECUTE FUNCTION test_fail_profile_audit()');
    try {
      const res = await saveProfile(69);
      expect(res.status).toBe(500);
    } finally {
      await t.pool.query('DROP TRIGGER test_fail_profile_audit ON audit_events');
      await t.pool.query('DROP FUNCTION test_fail_profile_audit()');
    }
    expect(await currentVersion()).toBe(before);
    expect((await t.ctx.db.select({ id: profileVersions.id }).from(profileVersions).where(eq(profileVersions.crewMemberId, crew))).length).toBe(profilesBefore);
    const s = await stateOf(v);
    expect(s.status).toBe('cleared');
    expect(s.staleSince).toBeNull();
    expect(s.records).toEqual([]);
  });

  it('a failure after the commit cannot leave the approval unflagged: the queued record is the outbox the reconcile pass sends', async () => {
    const v = await clearedVersion(t, crew, 'Recheck outbox');
    // The job queue fails after the transaction committed (as a crash between commit and enqueue would).
    const refused: string[][] = [];
    const failing: JobQueue = {
      enqueueReverification: (ids) => {
        refused.push(ids);
        return Promise.reject(new Error('queue down (injected)'));
      },
    };
    t.ctx.jobs = failing;
    let res;
    try {
      res = await saveProfile(70);
    } finally {
      t.ctx.jobs = undefined;
    }
    expect(res.status).toBe(201);
    expect(refused.flat()).toContain(v);
    const s = await stateOf(v);
    expect(s.status).toBe('recheck');
    expect(s.staleSince).not.toBeNull();
    expect(s.records.map((r) => [r.state, r.toProfileVersionId])).toEqual([['queued', bodyOf<VersionBody>(res).version.id]]);

    // The reconcile pass finds the record without a job (past its grace period) and sends it.
    await t.ctx.db.update(reverifications).set({ createdAt: new Date(Date.now() - 60_000) }).where(eq(reverifications.sequenceVersionId, v));
    const sent: [string[], string][] = [];
    // No job exists for anything here; the pass also re-sends the chunks of robustness runs the saves
    // above queued once they are past the grace period (a slow run gets there), so the fake takes them.
    const boss = { findJobs: () => Promise.resolve([]), insert: () => Promise.resolve() } as unknown as PgBoss;
    const out = await reconcileWork(t.ctx, {
      boss,
      enqueueReverification: (ids, to) => {
        sent.push([ids, to]);
        return Promise.resolve();
      },
    });
    expect(out.requeued).toBeGreaterThanOrEqual(1);
    expect(sent).toContainEqual([[v], bodyOf<VersionBody>(res).version.id]);
  });

  it('the profile save\'s own transaction flags: nothing after its commit (listener, job) is needed', async () => {
    const v = await clearedVersion(t, crew, 'Recheck same transaction');
    const [pv] = await t.ctx.db.select().from(profileVersions)
      .where(and(eq(profileVersions.crewMemberId, crew), eq(profileVersions.version, await currentVersion())));
    const { row, flagged } = await t.ctx.db.transaction((tx) => appendProfileVersion(tx, {
      crewMemberId: crew, baseVersion: pv.version, source: 'regression', inputs: pv.inputs, body: pv.body,
      summary: pv.summary, note: 'same body, new version (test)', authorId: null,
    }));
    // Only the commit has happened: the flag, its record and its audit event are already there.
    expect(flagged.versionIds).toContain(v);
    const s = await stateOf(v);
    expect(s.status).toBe('recheck');
    expect(s.records.map((r) => [r.state, r.toProfileVersionId])).toEqual([['queued', row.id]]);
  });

  it('with no queue running, the save still flags and records the re-verification (queued)', async () => {
    const v = await clearedVersion(t, crew, 'Recheck no queue');
    const res = await saveProfile(71);
    expect(res.status).toBe(201);
    const s = await stateOf(v);
    expect(s.status).toBe('recheck');
    const [record] = await t.ctx.db.select().from(reverifications)
      .where(and(eq(reverifications.sequenceVersionId, v), eq(reverifications.toProfileVersionId, bodyOf<VersionBody>(res).version.id)));
    expect(record.state).toBe('queued');
  });
});
