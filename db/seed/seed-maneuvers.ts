/**
 * Seed stage: the demo crew's maneuvers, composed from the limb-sweep primitives, with versions in
 * every status and reports really computed by the engine on the bound profile versions. Targets
 * are set to what the newest version reaches (rounded to whole degrees), as a planner would after
 * tuning the cycles. Everything here is invented demo data for the fictional "Lumen Ring" station.
 * Names say what the newest version does on its body (axis, direction, size): +yaw turns to the
 * left, +pitch forward (head down), +roll to the right (tests/planning/demo-names.test.ts checks them).
 */
import { desc, eq } from 'drizzle-orm';

import { recordAudit } from '../../server/audit/record-audit.ts';
import { saveRecheckVersion } from '../../server/maneuvers/recheck-version.ts';
import { targetQuat } from '../../server/maneuvers/target-attitude.ts';
import { verifySequence } from '../../server/maneuvers/verify-sequence.ts';
import { type SequenceTarget, sequenceTargetSchema, type StoredCompiled } from '../../shared/contracts/maneuver.ts';
import { sequenceSchema } from '../../shared/contracts/sequence.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { compilePrimitives, dofInfoFromBody } from '../../shared/primitives/compile-primitives.ts';
import { compiledStepCue } from '../../shared/primitives/primitive-cues.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';
import { type ProfileVersionRow,profileVersions, reverifications, reviews, sequences, sequenceVersions } from '../schema/index.ts';
import { seedVersionRobustness } from './demo-robustness.ts';
import { loadPlannedManeuvers } from './planned-maneuvers.ts';
import type { SeedState } from './run-seed.ts';

const PLANNER = 'orrin.vale@lumen.example.test';
const PLANNER_2 = 'pim.sorrel@lumen.example.test';
const REVIEWER = 'juno.brack@lumen.example.test';

/** One demo version: its primitives, status, and (for decided ones) the review. */
export interface DemoVersion {
  primitives: Primitive[];
  status: VersionStatus;
  /** Profile version number it is bound to (default: the member's current one). */
  profileVersion?: number;
  author?: string;
  note: string;
  review?: { decision: 'clear' | 'send_back'; comment: string };
}

/** One demo sequence. */
export interface DemoSequence {
  crew: string;
  name: string;
  versions: DemoVersion[];
  /** The target it was planned for (default: what the newest version reaches, rounded). */
  yprDeg?: { yaw: number; pitch: number; roll: number };
}

const HIP_SWIRLS: Primitive[] = [
  { kind: 'pose_shift', posture: 'arms_forward', durationS: 1.2 },
  { kind: 'hip_swirl', halfAngleDeg: 15, centreFlexDeg: 20, turn: 'to_left', cycles: 3, periodS: 2 },
  { kind: 'pose_shift', posture: 'reference', durationS: 1.2 },
];

const ARM_ORBITS: Primitive[] = [
  { kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 20, travel: 'outward', cycles: 4, periodS: 1.5 },
  { kind: 'pause', durationS: 0.5 },
];

/**
 * The demo maneuvers. Reed's profile has two versions (v1 pre-flight, v2 current), so her drill
 * cleared on v1 is now `recheck`; every trainee has a cleared maneuver to rehearse.
 */
export const DEMO_SEQUENCES: DemoSequence[] = [
  {
    crew: 'moss', name: 'Yaw to the right by hip swirls',
    versions: [
      { primitives: HIP_SWIRLS.map((p) => (p.kind === 'hip_swirl' ? { ...p, cycles: 2 } : p)), status: 'replaced', note: 'First draft: two swirls fall short of the turn.', review: { decision: 'clear', comment: 'Fine for cabin drills.' } },
      { primitives: HIP_SWIRLS, status: 'cleared', note: 'Three swirls to reach the full turn.', review: { decision: 'clear', comment: 'Rates well inside the limit. Cleared.' } },
    ],
  },
  {
    crew: 'reed', name: 'Forward pitch with arm orbits',
    versions: [
      {
        primitives: [{ ...ARM_ORBITS[0], halfAngleDeg: 35, periodS: 1 } as Primitive, ARM_ORBITS[1]], status: 'sent_back', note: 'Large fast orbits.',
        review: { decision: 'send_back', comment: 'Peak shoulder rate is above the limit; slow the orbits down.' },
      },
      { primitives: ARM_ORBITS, status: 'under_review', author: PLANNER_2, note: 'Slower, smaller orbits.' },
    ],
  },
  {
    crew: 'reed', name: 'Yaw trim with right-arm loops',
    versions: [{ primitives: [{ kind: 'arm_loop', arms: 'right', plane: 'frontal', swingDeg: 30, elbowDeg: 30, bendOn: 'forward_swing', cycles: 3, periodS: 2 }], status: 'drafting', note: 'Work in progress.' }],
  },
  {
    crew: 'reed', name: 'Pre-flight yaw drill',
    versions: [{ primitives: HIP_SWIRLS, status: 'recheck', profileVersion: 1, note: 'Cleared on the pre-flight profile.', review: { decision: 'clear', comment: 'Cleared for the pre-flight profile.' } }],
  },
  {
    // Tamsin Reed, the first demo trainee, has a cleared maneuver to rehearse on her current profile.
    crew: 'reed', name: 'Cabin yaw with hip swirls',
    versions: [{ primitives: HIP_SWIRLS, status: 'cleared', note: 'Drill on the current profile.', review: { decision: 'clear', comment: 'Cleared for cabin practice.' } }],
  },
  {
    crew: 'kettle', name: 'Spacewalk pitch trim with leg pedalling',
    versions: [{
      primitives: [
        { kind: 'leg_pedal', legs: 'both', pattern: 'together', hipCentreDeg: 40, hipSwingDeg: 20, kneeCentreDeg: 50, kneeSwingDeg: 25, direction: 'forward', cycles: 4, periodS: 2 },
        { kind: 'pause', durationS: 1 },
      ],
      status: 'cleared', note: 'Suited legs only; arms stay on the tether.', review: { decision: 'clear', comment: 'Cleared; watch knee flexion near the suited limit.' },
    }],
  },
  {
    crew: 'moss', name: 'Cabin yaw to the left with left-arm loops',
    versions: [{ primitives: [{ kind: 'arm_loop', arms: 'left', plane: 'sagittal', swingDeg: 25, elbowDeg: 30, bendOn: 'return_swing', cycles: 4, periodS: 2 }], status: 'drafting', note: 'First try.' }],
  },
];

/** Maneuvers the planner made for meaningful targets (db/seed/planned-maneuvers.json): waiting for review or being drafted. */
const PLANNED_SEQUENCES: DemoSequence[] = loadPlannedManeuvers().map((m, i) => ({
  crew: m.crew, name: m.name, yprDeg: m.yprDeg,
  versions: [{
    primitives: m.primitives, status: i % 2 ? 'drafting' : 'under_review', author: PLANNER_2,
    note: `Suggested by the planner for yaw ${m.yprDeg.yaw}°, pitch ${m.yprDeg.pitch}°, roll ${m.yprDeg.roll}°; robustness with feedback (95th percentile) ${m.feedbackP95Deg.toFixed(1)}°.`,
  }],
}));

const quatOf = (a: { w: number; x: number; y: number; z: number }) => [a.w, a.x, a.y, a.z];

/** Seed stage: inserts the demo maneuvers (after the crew profiles). */
export async function seedManeuvers(state: SeedState): Promise<void> {
  const { db, crewIds, userIds } = state;
  const profiles = async (crewMemberId: string) =>
    db.select().from(profileVersions).where(eq(profileVersions.crewMemberId, crewMemberId)).orderBy(desc(profileVersions.version));

  for (const demo of [...DEMO_SEQUENCES, ...PLANNED_SEQUENCES]) {
    const crewMemberId = crewIds[demo.crew];
    const all = await profiles(crewMemberId);
    if (!all.length) continue;
    const current = all[0];
    const pick = (n?: number): ProfileVersionRow => all.find((p) => p.version === n) ?? current;

    // Target: what the newest version reaches, rounded to whole degrees.
    const first = compilePrimitives(demo.versions[demo.versions.length - 1].primitives, dofInfoFromBody(current.body));
    const probeTarget = sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: { yaw: 0, pitch: 0, roll: 0 } });
    const probe = await verifySequence({ body: current.body, sequence: first.sequence, target: probeTarget, profileVersionId: current.id, pool: state.pool });
    const y = probe.final.yprDeg;
    const target: SequenceTarget = demo.yprDeg
      ? sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: demo.yprDeg, toleranceDeg: 2, rateLimitDegS: 180, timeBudgetS: 90 })
      : sequenceTargetSchema.parse({
        mode: 'ypr', yprDeg: { yaw: Math.round(y.yaw), pitch: Math.round(y.pitch), roll: Math.round(y.roll) }, toleranceDeg: 3, rateLimitDegS: 150, timeBudgetS: 30,
      });

    const [seq] = await db.insert(sequences).values({ crewMemberId, name: demo.name, target, createdBy: userIds[PLANNER] }).returning();
    for (const [i, v] of demo.versions.entries()) {
      const profile = pick(v.profileVersion);
      const body = profile.body;
      const compiled = compilePrimitives(v.primitives, dofInfoFromBody(body));
      const report = await verifySequence({ body, sequence: compiled.sequence, target, profileVersionId: profile.id, pool: state.pool, stepMap: compiled.stepMap });
      const stored: StoredCompiled = {
        sequence: compiled.sequence,
        cues: compiled.stepMap.map((s) => compiledStepCue(v.primitives[s.primitive], s.role)),
        stepMap: compiled.stepMap,
      };
      const author = userIds[v.author ?? PLANNER];
      const wasCleared = v.review?.decision === 'clear';
      const submitted = v.status !== 'drafting';
      const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000);
      const [row] = await db.insert(sequenceVersions).values({
        sequenceId: seq.id, version: i + 1, primitives: v.primitives, target, compiled: stored, profileVersionId: profile.id,
        status: v.status, report, engineVersion: report.engineVersion, inputsHash: report.inputsHash, authorId: author, note: v.note,
        // Saved before it was submitted, submitted before it was decided: the screens show all three times.
        createdAt: minutesAgo(100 - i * 20),
        submittedAt: submitted ? minutesAgo(90 - i * 20) : null,
        clearedBy: wasCleared ? userIds[REVIEWER] : null, clearedAt: wasCleared ? minutesAgo(80 - i * 20) : null,
        staleSince: v.status === 'recheck' ? minutesAgo(30) : null,
      }).returning();
      await recordAudit(db, { actorId: author, action: 'sequence_version.save', objectType: 'sequence_version', objectId: row.id, detail: { sequenceId: seq.id, version: row.version, seed: true } });
      // Its robustness run, as the save queued it (computed ahead: db/seed/demo-robustness.ts).
      await seedVersionRobustness(db, row.id, {
        body, sequence: sequenceSchema.parse(stored.sequence), target: targetQuat(target), toleranceDeg: target.toleranceDeg,
      }, author, minutesAgo(99 - i * 20));
      if (v.review) {
        await db.insert(reviews).values({
          sequenceVersionId: row.id, reviewerId: userIds[REVIEWER], decision: v.review.decision, comment: v.review.comment,
          profileVersionId: profile.id, engineVersion: report.engineVersion, createdAt: minutesAgo(80 - i * 20),
        });
        await recordAudit(db, { actorId: userIds[REVIEWER], action: `sequence_version.${v.review.decision}`, objectType: 'sequence_version', objectId: row.id, detail: { comment: v.review.comment, seed: true } });
      }
      // A recheck version: its recomputation on the current profile, done as the worker would.
      // The worker's re-check then saves the next version for the reviewer (the product's own code:
      // saveRecheckVersion), with its robustness run as the save of a re-check version queues it.
      if (v.status === 'recheck' && profile.id !== current.id) {
        const again = await verifySequence({ body: current.body, sequence: compiled.sequence, target, profileVersionId: current.id, pool: state.pool, stepMap: compiled.stepMap });
        const attitudeShiftDeg = (quatAngleBetween(quatOf(report.final.attitude), quatOf(again.final.attitude)) * 180) / Math.PI;
        const saved = await db.transaction(async (tx) => {
          const [rev] = await tx.insert(reverifications).values({
            sequenceVersionId: row.id, fromProfileVersionId: profile.id, toProfileVersionId: current.id, state: 'done', attempts: 1,
            attitudeShiftDeg, report: again, finishedAt: minutesAgo(25),
          }).returning({ id: reverifications.id });
          return saveRecheckVersion(tx, { stale: row, profile: current, report: again, reverificationId: rev.id, attitudeShiftDeg });
        });
        if (saved) {
          await seedVersionRobustness(db, saved.id, {
            body: current.body, sequence: sequenceSchema.parse(stored.sequence), target: targetQuat(target), toleranceDeg: target.toleranceDeg,
          }, null, minutesAgo(24));
        }
      }
    }
  }
}
