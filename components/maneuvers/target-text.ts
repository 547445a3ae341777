import type { SequenceTarget } from '@/shared/contracts/maneuver';
import { targetWords } from '@/shared/product/target-words';

import { fmtNum } from './report/format';

/** The target in words with its tolerance, on screen: "yaw 90°, pitch 0°, roll 0° (±2.0°)" or "60° about [0, 0, 1] (±2.0°)". */
export function targetText(t: SequenceTarget): string {
  return `${targetWords(t, '−')} (±${fmtNum(t.toleranceDeg, 1)}°)`;
}
