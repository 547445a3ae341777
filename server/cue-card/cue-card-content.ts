/**
 * What a printed cue card says, assembled from a version as the API shows it (pure: no database,
 * no PDF). The steps are the compiled steps the rehearsal player counts, each with the cue of the
 * primitive it came from, so the card's step numbers match the player's.
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { SequenceTarget, VerificationReport, VersionDetail } from '../../shared/contracts/maneuver.ts';
import type { RobustnessLevel, VersionRobustness } from '../../shared/contracts/robustness.ts';
import { quatToYpr } from '../../shared/math/euler-zyx.ts';
import { DOF_LABELS, isDofName } from '../../shared/model/dof-names.ts';
import { engineBindingText, shortEngineVersion } from '../../shared/product/engine-binding.ts';
import { robustnessSentence } from '../../shared/product/robustness-wording.ts';
import { targetWords } from '../../shared/product/target-words.ts';
import { HttpError } from '../http/http-error.ts';
import { stepTimeline } from '../maneuvers/step-timeline.ts';
import { CUE_CARD_CAUTIONS } from './cue-card-cautions.ts';
import { cueCardFileName } from './cue-card-file-name.ts';
import { type StepPictogram, stepPictograms } from './step-pictograms.ts';

/** One printed step. */
export interface CueCardStep {
  /** 1-based, as the rehearsal player numbers steps. */
  number: number;
  /** Start and duration, seconds from the sequence start. */
  startS: number;
  durationS: number;
  /** Plain-language cue, capitalised. */
  cue: string;
  /** The step's lead-in (a joining move into its start posture) in a few words with its length, or null. */
  leadIn: string | null;
}

/** Everything printed on one card; angles in degrees, times in seconds, timestamps ISO-8601. */
export interface CueCardContent {
  /** The product mark, lower case as the app writes it. */
  productMark: 'holonaut';
  /** Card title. */
  title: string;
  sequenceName: string;
  /** Version number within the sequence. */
  version: number;
  crewMemberName: string;
  /** The crew member's call sign; null when none is on file. */
  callSign: string | null;
  /** Number of the bound profile version. */
  profileVersion: number;
  /** Always "Cleared": only cleared versions get a card. */
  statusLabel: 'Cleared';
  clearedByName: string | null;
  clearedAt: string | null;
  /** Engine version with its source hash cut to 8 characters ("1.4.0+ab12cd34"), or null. */
  engineVersionShort: string | null;
  /** When the server now runs another engine than the one that verified this version: that, in words; else null. */
  engineNote: string | null;
  /** First 12 hex digits of the inputs hash, or null. */
  inputsHashShort: string | null;
  /** The target in words, e.g. "yaw 90°, pitch 0°, roll 0°" or "60° about [0, 0, 1]". */
  targetText: string;
  toleranceDeg: number;
  /** What the verified run reaches; null when the version has no report. */
  reached: {
    /** Yaw/pitch/roll reached, in words. */
    attitudeText: string;
    /** Rotation angle between reached and target attitude, degrees. */
    errorDeg: number;
    withinTolerance: boolean;
    durationS: number;
  } | null;
  /** Peak joint rate against the sequence's limit; null without a report. */
  peakJointRate: { maxDegS: number; dofLabel: string | null; limitDegS: number; withinLimit: boolean } | null;
  /**
   * The robustness run's verdict, printed before the steps: the level's sentence (a caution for
   * marginal and not robust), the percentiles and the run's seed; `level` null while not done.
   */
  robustness: {
    level: RobustnessLevel | null;
    sentence: string;
    /** "95th pct. with feedback 4.1°, open-loop 12.0°; median 1.3°; 62 % within tolerance (1,000 samples, seed 1)", or null while not done. */
    figures: string | null;
  };
  steps: CueCardStep[];
  /** One stick-figure pictogram per step (same order), or null without the body or a report. */
  pictograms: StepPictogram[] | null;
  /** The verified attitude over time (unwrapped yaw/pitch/roll, degrees) with the target's, or null without a report. */
  attitude: { t: number[]; yaw: number[]; pitch: number[]; roll: number[]; target: { yaw: number; pitch: number; roll: number } } | null;
  cautions: readonly string[];
  /** Download name (sanitised). */
  fileName: string;
}

const deg = (v: number, digits = 0) => `${Number(v.toFixed(digits))}°`;

/** The report's attitude series and the target as yaw/pitch/roll in degrees, for the card's small plot. */
function attitudeSeries(r: VerificationReport, target: SequenceTarget): CueCardContent['attitude'] {
  const ypr = target.mode === 'ypr' ? target.yprDeg : (() => {
    const a = quatToYpr([r.target.attitude.w, r.target.attitude.x, r.target.attitude.y, r.target.attitude.z]);
    const d = 180 / Math.PI;
    return { yaw: a.yaw * d, pitch: a.pitch * d, roll: a.roll * d };
  })();
  return { t: r.series.t, yaw: r.series.yawDeg, pitch: r.series.pitchDeg, roll: r.series.rollDeg, target: ypr };
}

/** The card's robustness lines from the version's newest run. */
function robustnessLines(rb: VersionRobustness | null): CueCardContent['robustness'] {
  const done = rb?.state === 'done' && rb.feedbackP95Deg !== null;
  return {
    level: done ? rb.level : null,
    sentence: robustnessSentence(rb),
    figures: done
      ? `95th percentile with feedback ${deg(rb.feedbackP95Deg ?? 0, 1)}, open-loop ${deg(rb.openLoopP95Deg ?? 0, 1)}; median ${deg(rb.p50Deg ?? 0, 1)}; ${Math.round((rb.withinToleranceShare ?? 0) * 100)} % within tolerance (${rb.samples.toLocaleString('en-US')} samples, seed ${rb.seed})`
      : null,
  };
}

/**
 * The card for a cleared version. Throws HttpError 409 `not_cleared` for any other status. The
 * steps are the player's step list (the version's compiled steps grouped by its step map).
 */
export function cueCardContent(v: VersionDetail, crew: { callSign: string | null }, runningEngineVersion: string, body: Body | null = null): CueCardContent {
  if (v.status !== 'cleared') {
    throw new HttpError(409, 'not_cleared', `Only cleared versions have a cue card; version ${v.version} is ${v.status.replace('_', ' ')}.`);
  }
  const timeline = stepTimeline(v.compiled, [], { primitives: v.primitives, stepMap: v.stepMap });
  const r = v.report;
  const target = v.target;
  const steps: CueCardStep[] = timeline.map((s) => ({
    number: s.index + 1, startS: s.start, durationS: s.end - s.start, cue: s.cue,
    leadIn: s.leadIn ? `${s.leadIn.cue} (${Number((s.leadIn.end - s.start).toFixed(1))} s)` : null,
  }));
  const verifiedBy = v.engineVersion ?? r?.engineVersion ?? null;
  return {
    productMark: 'holonaut',
    title: 'Cue card',
    sequenceName: v.sequence.name,
    version: v.version,
    crewMemberName: v.sequence.crewMemberName,
    callSign: crew.callSign?.trim() || null,
    profileVersion: v.profileVersion,
    statusLabel: 'Cleared',
    clearedByName: v.clearedByName,
    clearedAt: v.clearedAt,
    engineVersionShort: verifiedBy ? shortEngineVersion(verifiedBy) : null,
    engineNote: verifiedBy && verifiedBy !== runningEngineVersion ? engineBindingText(verifiedBy, runningEngineVersion) : null,
    inputsHashShort: (v.inputsHash ?? r?.inputsHash)?.slice(0, 12) ?? null,
    targetText: targetWords(target),
    toleranceDeg: target.toleranceDeg,
    reached: r ? {
      attitudeText: `yaw ${deg(r.final.yprDeg.yaw, 1)}, pitch ${deg(r.final.yprDeg.pitch, 1)}, roll ${deg(r.final.yprDeg.roll, 1)}`,
      errorDeg: r.target.errorDeg,
      withinTolerance: r.target.withinTolerance,
      durationS: r.durationS,
    } : null,
    peakJointRate: r ? {
      maxDegS: r.peakJointRate.maxDegS,
      dofLabel: r.peakJointRate.dof ? (isDofName(r.peakJointRate.dof) ? DOF_LABELS[r.peakJointRate.dof].replace(/ \(.*\)$/, '') : r.peakJointRate.dof) : null,
      limitDegS: r.peakJointRate.limitDegS,
      withinLimit: r.peakJointRate.withinLimit,
    } : null,
    robustness: robustnessLines(r?.robustness ?? null),
    steps,
    pictograms: body && r ? stepPictograms(body, r, steps) : null,
    attitude: r ? attitudeSeries(r, target) : null,
    cautions: CUE_CARD_CAUTIONS,
    fileName: cueCardFileName(v.sequence.name, v.version),
  };
}
