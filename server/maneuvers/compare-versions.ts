/** Side-by-side comparison of two versions: primitives position by position, and result figures. */
import type { CompareResponse, VerificationReport, VersionDetail } from '../../shared/contracts/maneuver.ts';
import { quatAngleBetween } from '../../shared/math/quaternion.ts';
import { cueFor } from '../../shared/primitives/primitive-cues.ts';
import { canonicalJson } from './inputs-hash.ts';

const DEG = 180 / Math.PI;

function figure(a: number | null | undefined, b: number | null | undefined) {
  const av = a ?? null, bv = b ?? null;
  return { a: av, b: bv, delta: av !== null && bv !== null ? bv - av : null };
}

const quat = (r: VerificationReport) => [r.final.attitude.w, r.final.attitude.x, r.final.attitude.y, r.final.attitude.z];

/** Compares version a with version b (b − a for every figure). */
export function compareVersions(a: VersionDetail, b: VersionDetail): CompareResponse {
  const n = Math.max(a.primitives.length, b.primitives.length);
  const primitives: CompareResponse['primitives'] = [];
  for (let i = 0; i < n; i++) {
    const pa = a.primitives[i], pb = b.primitives[i];
    const change = !pa ? 'added' : !pb ? 'removed' : canonicalJson(pa) === canonicalJson(pb) ? 'same' : 'changed';
    primitives.push({ index: i, change, a: pa ? cueFor(pa) : null, b: pb ? cueFor(pb) : null });
  }
  const ra = a.report, rb = b.report;
  const { sequence: _sa, primitives: _pa, cues: _ca, compiled: _cpa, stepMap: _ma, report: _ra, reviews: _rva, reverifications: _rea, allowed: _aa, ...sa } = a;
  const { sequence: _sb, primitives: _pb, cues: _cb, compiled: _cpb, stepMap: _mb, report: _rb, reviews: _rvb, reverifications: _reb, allowed: _ab, ...sb } = b;
  return {
    a: sa,
    b: sb,
    sameProfile: a.profileVersionId === b.profileVersionId,
    sameEngine: a.engineVersion === b.engineVersion,
    primitives,
    result: {
      durationS: figure(ra?.durationS, rb?.durationS),
      targetErrorDeg: figure(ra?.target.errorDeg, rb?.target.errorDeg),
      yawDeg: figure(ra?.final.yprDeg.yaw, rb?.final.yprDeg.yaw),
      pitchDeg: figure(ra?.final.yprDeg.pitch, rb?.final.yprDeg.pitch),
      rollDeg: figure(ra?.final.yprDeg.roll, rb?.final.yprDeg.roll),
      peakJointRateDegS: figure(ra?.peakJointRate.maxDegS, rb?.peakJointRate.maxDegS),
      rangeViolationCount: figure(ra?.rangeViolations.length, rb?.rangeViolations.length),
      finalAttitudeShiftDeg: ra && rb ? quatAngleBetween(quat(ra), quat(rb)) * DEG : null,
    },
  };
}
