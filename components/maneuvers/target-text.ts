import type { SequenceTarget } from '@/shared/contracts/maneuver';

import { fmtDeg, fmtNum } from './report/format';

/** The target in words: "yaw 90°, pitch 0°, roll 0° (±2°)" or "60° about [0, 0, 1] (±2°)". */
export function targetText(t: SequenceTarget): string {
  const tol = ` (±${fmtNum(t.toleranceDeg, 1)}°)`;
  if (t.mode === 'ypr') return `yaw ${fmtDeg(t.yprDeg.yaw, 0)}, pitch ${fmtDeg(t.yprDeg.pitch, 0)}, roll ${fmtDeg(t.yprDeg.roll, 0)}${tol}`;
  return `${fmtDeg(t.axisAngle.angleDeg, 0)} about [${t.axisAngle.axis.map((a) => fmtNum(a, 2)).join(', ')}]${tol}`;
}
