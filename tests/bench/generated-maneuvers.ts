/**
 * Bench data: N generated maneuvers (invented, on the demo crew) on top of the demo seed, each with
 * 1–3 versions in the statuses a working team accumulates (drafting, under review, cleared, sent
 * back, replaced) and real verification reports computed by the engine. Reports are computed once
 * per distinct (steps, profile version) and reused, so generation stays a few seconds.
 */
import { and, eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, type ProfileVersionRow,profileVersions, reviews, sequences, sequenceVersions, users } from '../../db/schema/index.ts';
import type { SimulationPool } from '../../server/engine/pool/simulation-pool.ts';
import { verifySequence } from '../../server/maneuvers/verify-sequence.ts';
import { sequenceTargetSchema, type StoredCompiled, type VerificationReport } from '../../shared/contracts/maneuver.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { compiledStepCue } from '../../shared/primitives/primitive-cues.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';

/** Step lists the generator cycles through (cycle counts vary per maneuver). */
const FAMILIES: ((cycles: number) => Primitive[])[] = [
  (cycles) => [
    { kind: 'pose_shift', posture: 'arms_forward', durationS: 1.2 },
    { kind: 'hip_swirl', halfAngleDeg: 15, centreFlexDeg: 20, turn: 'to_left', cycles, periodS: 2 },
    { kind: 'pose_shift', posture: 'reference', durationS: 1.2 },
  ],
  (cycles) => [
    { kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 20, travel: 'outward', cycles, periodS: 1.5 },
    { kind: 'pause', durationS: 0.5 },
  ],
  (cycles) => [{ kind: 'arm_loop', arms: 'right', plane: 'frontal', swingDeg: 30, elbowDeg: 30, bendOn: 'forward_swing', cycles, periodS: 2 }],
];

/** Status of each version, oldest first, for a maneuver with `count` versions and pattern `k`. */
function statuses(count: number, k: number): VersionStatus[] {
  const latest: VersionStatus[] = ['drafting', 'under_review', 'cleared', 'sent_back'];
  const older: VersionStatus = k % 2 ? 'sent_back' : 'replaced';
  return [...Array.from({ length: count - 1 }, () => older), latest[k % latest.length]];
}

/** Inserts `count` generated maneuvers; returns how many versions were written. */
export async function addGeneratedManeuvers(db: Database, count: number, pool: SimulationPool): Promise<number> {
  const members = await db.select().from(crewMembers).orderBy(crewMembers.name);
  const current = new Map<string, ProfileVersionRow>();
  for (const m of members) {
    if (m.currentVersion === null) continue;
    const [pv] = await db.select().from(profileVersions).where(and(eq(profileVersions.crewMemberId, m.id), eq(profileVersions.version, m.currentVersion)));
    current.set(m.id, pv);
  }
  const [planner] = await db.select().from(users).where(eq(users.role, 'planner'));
  const [reviewer] = await db.select().from(users).where(eq(users.role, 'reviewer'));
  const reports = new Map<string, { compiled: StoredCompiled; report: VerificationReport }>();
  const target = sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 30, pitch: 0, roll: 0 }, toleranceDeg: 3 });
  let written = 0;

  const withProfile = members.filter((m) => current.has(m.id));
  for (let i = 0; i < count; i++) {
    const member = withProfile[i % withProfile.length];
    const profile = current.get(member.id)!;
    const [seq] = await db.insert(sequences).values({ crewMemberId: member.id, name: `Generated drill ${String(i + 1).padStart(3, '0')}`, target, createdBy: planner.id }).returning();
    const plan = statuses(1 + (i % 3), i);
    for (const [j, status] of plan.entries()) {
      const family = (i + j) % FAMILIES.length;
      const cycles = 2 + ((i + j) % 3);
      const key = `${family}|${cycles}|${profile.id}`;
      let computed = reports.get(key);
      if (!computed) {
        const primitives = FAMILIES[family](cycles);
        const c = compilePrimitives(primitives, dofInfoFromBody(profile.body));
        const report = await verifySequence({ body: profile.body, sequence: c.sequence, target, profileVersionId: profile.id, pool });
        computed = {
          report,
          compiled: {
            sequence: c.sequence,
            cues: c.stepMap.map((s) => compiledStepCue(primitives[s.primitive], s.role)),
            stepMap: c.stepMap,
          },
        };
        reports.set(key, computed);
      }
      const { report, compiled } = computed;
      const cleared = status === 'cleared';
      const decided = cleared || status === 'sent_back';
      const ago = (m: number) => new Date(Date.now() - (count - i) * 3_600_000 - m * 60_000);
      const [row] = await db.insert(sequenceVersions).values({
        sequenceId: seq.id, version: j + 1, primitives: FAMILIES[family](cycles), target, compiled, profileVersionId: profile.id,
        status, report, engineVersion: report.engineVersion, inputsHash: report.inputsHash, authorId: planner.id,
        note: `Generated version ${j + 1}.`, createdAt: ago(60 - j * 10), submittedAt: status === 'drafting' ? null : ago(55 - j * 10),
        clearedBy: cleared ? reviewer.id : null, clearedAt: cleared ? ago(50 - j * 10) : null,
      }).returning({ id: sequenceVersions.id });
      if (decided) {
        await db.insert(reviews).values({
          sequenceVersionId: row.id, reviewerId: reviewer.id, decision: cleared ? 'clear' : 'send_back', comment: cleared ? 'Cleared.' : 'Slow it down.',
          profileVersionId: profile.id, engineVersion: report.engineVersion, createdAt: ago(50 - j * 10),
        });
      }
      written++;
    }
  }
  return written;
}
