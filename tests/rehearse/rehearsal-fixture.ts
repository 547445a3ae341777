/**
 * Invented demo data for the rehearsal tests: a standard-human profile version for a crew member and
 * a sequence version in a chosen status, inserted straight into the tables with the verification
 * report the save path would store (the maneuvers API that normally creates them is tested on its own).
 */
import { eq, max } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, profileVersions, sequences, sequenceVersions, users } from '../../db/schema/index.ts';
import { summarizeBody } from '../../server/crew/profile-summary.ts';
import { simulate } from '../../server/engine/simulate.ts';
import { buildReport } from '../../server/maneuvers/build-report.ts';
import { inputsHash } from '../../server/maneuvers/inputs-hash.ts';
import { REPORT_RATE_HZ } from '../../server/maneuvers/verify-sequence.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import { validateBody } from '../../shared/contracts/body.ts';
import { type SequenceTarget,sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { validateSequence } from '../../shared/contracts/sequence.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import { dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';

/** An arm-sweep maneuver on the standard human model: position, 3 cone cycles, hold, return (invented). */
export const ARM_SWEEP = {
  start: {},
  steps: [
    { kind: 'move', duration: 1, to: { r_sh_flex: 90, l_sh_flex: 90 } },
    {
      kind: 'harmonic', period: 1.5, cycles: 3,
      joints: {
        r_sh_flex: { offset: 60, amplitude: 30, phase: 90 },
        r_sh_abd: { offset: 0, amplitude: 30, phase: 0 },
        l_sh_flex: { offset: 60, amplitude: 30, phase: 90 },
        l_sh_abd: { offset: 0, amplitude: 30, phase: 180 },
      },
    },
    { kind: 'hold', duration: 0.5 },
    { kind: 'move', duration: 1, to: { r_sh_flex: 0, l_sh_flex: 0 } },
  ],
} as const;

/** Crew member id of a demo user (by e-mail). */
export async function crewMemberOf(db: Database, email: string): Promise<string> {
  const [u] = await db.select({ c: users.crewMemberId }).from(users).where(eq(users.email, email));
  if (!u?.c) throw new Error(`${email} has no crew member`);
  return u.c;
}

/** Inserts the next profile version (standard human, 1.68 m, 61 kg) for a crew member; returns its id. */
export async function insertProfileVersion(db: Database, crewMemberId: string): Promise<string> {
  const [{ last }] = await db.select({ last: max(profileVersions.version) }).from(profileVersions).where(eq(profileVersions.crewMemberId, crewMemberId));
  const version = (last ?? 0) + 1;
  const d = deriveBody({ sex: 'female', stature: 1.68, mass: 61 });
  const [row] = await db
    .insert(profileVersions)
    .values({ crewMemberId, version, inputs: d.inputs, body: d.body, summary: summarizeBody(d.body, 'test'), engineVersion: 'test' })
    .returning({ id: profileVersions.id });
  await db.update(crewMembers).set({ currentVersion: version }).where(eq(crewMembers.id, crewMemberId));
  return row.id;
}

/** Inserts a sequence with one version in `status`, verified by the engine as a save would; returns the version id. */
export async function insertVersion(
  db: Database,
  opts: { crewMemberId: string; profileVersionId: string; status: VersionStatus; name?: string; compiled?: unknown; primitives?: Primitive[]; target?: SequenceTarget },
): Promise<string> {
  const target = opts.target ?? sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 0, pitch: -20, roll: 0 } });
  const [pv] = await db.select({ body: profileVersions.body }).from(profileVersions).where(eq(profileVersions.id, opts.profileVersionId));
  const body = validateBody(pv.body);
  if (!body.ok) throw new Error(`fixture body: ${body.issues[0].message}`);
  const sequence = validateSequence(opts.compiled ?? ARM_SWEEP, body.value);
  if (!sequence.ok) throw new Error(`fixture sequence: ${sequence.issues[0].message}`);
  const result = simulate(body.value, sequence.value, { rateHz: REPORT_RATE_HZ });
  const report = buildReport({ result, target, profileVersionId: opts.profileVersionId, dofs: dofInfoFromBody(body.value), inputsHash: inputsHash(body.value, sequence.value) });
  const [seq] = await db
    .insert(sequences)
    .values({ crewMemberId: opts.crewMemberId, name: opts.name ?? 'Arm cone, both sides', target })
    .returning({ id: sequences.id });
  const [v] = await db
    .insert(sequenceVersions)
    .values({
      sequenceId: seq.id, version: 1, primitives: opts.primitives ?? [], target, compiled: opts.compiled ?? ARM_SWEEP,
      profileVersionId: opts.profileVersionId, status: opts.status, report, engineVersion: report.engineVersion, inputsHash: report.inputsHash,
      clearedAt: opts.status === 'cleared' ? new Date() : null,
    })
    .returning({ id: sequenceVersions.id });
  return v.id;
}
