/**
 * What a rehearsal recording would have done in orbit: the recorded joint angles simulated as a
 * track on the profile version the plan was verified for (like with like) and, when different, on
 * the trainee's current profile; the reached attitude against the plan's target and the plan's own
 * result; per sweep step, timing and amplitude against the plan; and the overlay series.
 */
import { eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { profileVersions } from '../../db/schema/index.ts';
import { validateBody } from '../../shared/contracts/body.ts';
import type { CaptureOutcome, CaptureOverlay, StoredCapture } from '../../shared/contracts/recording.ts';
import type { Attitude, SimulationResult } from '../../shared/contracts/result.ts';
import { type Sequence, validateSequence } from '../../shared/contracts/sequence.ts';
import { quatToYpr } from '../../shared/math/euler-zyx.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { type SimulationPool, SimulationTimeoutError } from '../engine/pool/simulation-pool.ts';
import { HttpError } from '../http/http-error.ts';
import { currentProfile } from '../maneuvers/current-profile.ts';
import { versionStepList } from '../maneuvers/step-timeline.ts';
import type { StoredVersion } from '../maneuvers/stored-version.ts';
import { targetAttitude } from '../maneuvers/target-attitude.ts';
import { compareExecution, type RecordedTrack, recordingSequence } from './compare-execution.ts';

/** Overlay sample rate, Hz. */
const OVERLAY_HZ = 20;
const DEG = 180 / Math.PI;

const q4 = (a: Attitude) => [a.w, a.x, a.y, a.z];
const yprDeg = (a: Attitude) => { const y = quatToYpr(q4(a)); return { yaw: y.yaw * DEG, pitch: y.pitch * DEG, roll: y.roll * DEG }; };
const turnDeg = (a: Attitude) => 2 * Math.acos(Math.min(1, Math.abs(a.w))) * DEG;

/** Simulates in the worker pool; a contract problem is a 422 naming the field. */
async function run(pool: SimulationPool, body: unknown, sequence: Sequence, what: string): Promise<SimulationResult> {
  try {
    const reply = await pool.run(body, sequence, { rateHz: OVERLAY_HZ });
    if (reply.kind === 'invalid') throw new HttpError(422, 'recording_invalid', `The ${what} cannot be simulated: ${reply.issues[0].message}`, 'file');
    return reply.result;
  } catch (err) {
    if (err instanceof SimulationTimeoutError) throw new HttpError(503, 'simulation_timeout', err.message);
    throw err;
  }
}

/** Builds the capture for a recording of version `v` (the sign-off is added by the caller). */
export async function buildCapture(
  db: Database, pool: SimulationPool, v: StoredVersion, rec: RecordedTrack, meta: { rehearsalId: string; uploadId: string; fileName: string; assumptions: string[]; createdAt: Date },
): Promise<StoredCapture> {
  const body = validateBody(v.body);
  if (!body.ok) throw new HttpError(422, 'motion_invalid', `The plan's profile body cannot be simulated: ${body.issues[0].message}`);
  const plan = validateSequence(v.compiled.sequence, body.value);
  if (!plan.ok) throw new HttpError(422, 'motion_invalid', `The plan cannot be simulated: ${plan.issues[0].message}`);
  const recSeq = recordingSequence(plan.value, rec);
  const checked = validateSequence(recSeq, body.value);
  if (!checked.ok) throw new HttpError(422, 'recording_invalid', `The recording does not fit this body: ${checked.issues[0].message}`, 'file');

  // Like with like: the plan's profile version; then the current one when it differs.
  const planResult = await run(pool, body.value, plan.value, 'plan');
  const target = targetAttitude(v.target);
  const profiles: { id: string; version: number; body: unknown; role: CaptureOutcome['role'] }[] = [];
  const current = await currentProfile(db, v.crewMemberId).catch(() => null);
  const planVersionNumber = current && current.id === v.profileVersionId ? current.version : await profileNumber(db, v.profileVersionId);
  profiles.push({ id: v.profileVersionId, version: planVersionNumber, body: body.value, role: 'plan' });
  if (current && current.id !== v.profileVersionId) profiles.push({ id: current.id, version: current.version, body: current.body, role: 'current' });
  const outcomes: CaptureOutcome[] = [];
  let executed: SimulationResult | null = null;
  for (const p of profiles) {
    const r = await run(pool, p.body, recSeq, p.role === 'plan' ? 'recording' : 'recording on the current profile');
    if (p.role === 'plan') executed = r;
    outcomes.push({
      profileVersionId: p.id, profileVersion: p.version, role: p.role, reached: r.final.attitude, reachedYprDeg: yprDeg(r.final.attitude),
      errorToTargetDeg: quatAngleBetween(q4(r.final.attitude), q4(target)) * DEG,
      errorToPlanDeg: quatAngleBetween(q4(r.final.attitude), q4(planResult.final.attitude)) * DEG,
    });
  }

  // Step timing per composer step (DECISIONS.md "Steps": numbered and worded as the player and the
  // composer list them): a compared sweep (a compiled step) belongs to the listed step whose span holds its start.
  const timeline = versionStepList(v);
  const steps = compareExecution(plan.value, rec).map((s) => {
    const listed = timeline.find((e) => s.startS >= e.start - 1e-9 && s.startS < e.end - 1e-9);
    return { ...s, step: listed ? listed.index + 1 : s.step + 1, cue: listed?.cue ?? `Step ${s.step + 1}` };
  });

  // Overlay: both at OVERLAY_HZ from t = 0, over the shorter of the two.
  const n = Math.min(planResult.samples.frames.length, executed!.samples.frames.length);
  const overlay: CaptureOverlay = { t: [], planned: {}, executed: {}, plannedTurnDeg: [], executedTurnDeg: [] };
  const dofIdx = rec.dofs.map((d) => planResult.samples.dofs.indexOf(d));
  rec.dofs.forEach((d) => { overlay.planned[d] = []; overlay.executed[d] = []; });
  for (let k = 0; k < n; k++) {
    const pf = planResult.samples.frames[k], ef = executed!.samples.frames[k];
    overlay.t.push(pf.t);
    rec.dofs.forEach((d, j) => { overlay.planned[d].push(pf.jointsDeg[dofIdx[j]]); overlay.executed[d].push(ef.jointsDeg[dofIdx[j]]); });
    overlay.plannedTurnDeg.push(turnDeg(pf.attitude));
    overlay.executedTurnDeg.push(turnDeg(ef.attitude));
  }
  return {
    rehearsalId: meta.rehearsalId, uploadId: meta.uploadId, fileName: meta.fileName, rateHz: rec.rateHz,
    duration: (rec.frames.length - 1) / rec.rateHz, dofs: rec.dofs,
    assumptions: [...meta.assumptions, 'The recording\'s first frame is the plan\'s t = 0; dofs not recorded stay at the plan\'s start posture.'],
    targetYprDeg: yprDeg(target), planReachedYprDeg: yprDeg(planResult.final.attitude),
    outcomes, steps, overlay, createdAt: meta.createdAt.toISOString(),
  };
}

/** The version number of a profile version. */
async function profileNumber(db: Database, id: string): Promise<number> {
  const [row] = await db.select({ version: profileVersions.version }).from(profileVersions).where(eq(profileVersions.id, id));
  return row?.version ?? 0;
}
