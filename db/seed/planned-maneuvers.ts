/**
 * Demo maneuvers made by the planner for meaningful targets (invented demo data). The steps come
 * from db/seed/planned-maneuvers.json, written by plan-demo-maneuvers.ts.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

import { type SequenceTarget, sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import type { Primitive } from '../../shared/primitives/primitive-schemas.ts';

/** What a planned demo maneuver is for. */
export interface PlannedManeuverSpec {
  crew: 'reed' | 'kettle' | 'moss';
  name: string;
  yprDeg: { yaw: number; pitch: number; roll: number };
}

/** A planned demo maneuver with the planner's steps. */
export interface PlannedManeuver extends PlannedManeuverSpec {
  primitives: Primitive[];
  /** Error to target when it was planned, degrees. */
  plannedErrorDeg: number;
  feedbackP95Deg: number;
}

/** The targets the planner made demo maneuvers for. */
export const PLANNED_DEMO_MANEUVERS: PlannedManeuverSpec[] = [
  { crew: 'moss', name: 'Quarter turn to the left', yprDeg: { yaw: 90, pitch: 0, roll: 0 } },
  { crew: 'reed', name: 'Half turn to face aft', yprDeg: { yaw: 180, pitch: 0, roll: 0 } },
  { crew: 'kettle', name: 'Pitch-over in the suit (forward 90°)', yprDeg: { yaw: 0, pitch: 90, roll: 0 } },
  { crew: 'kettle', name: 'Quarter turn to the left in the suit', yprDeg: { yaw: 90, pitch: 0, roll: 0 } },
  { crew: 'moss', name: 'Roll 45° to the right', yprDeg: { yaw: 0, pitch: 0, roll: 45 } },
];

/** The target a demo maneuver was planned for: its yaw/pitch/roll, 2° tolerance, 180°/s rate limit. */
export function plannedTarget(m: PlannedManeuverSpec): SequenceTarget {
  return sequenceTargetSchema.parse({ mode: 'ypr', yprDeg: m.yprDeg, toleranceDeg: 2, rateLimitDegS: 180 });
}

/** Path of the committed plans. */
export const plannedManeuversFile = fileURLToPath(new URL('./planned-maneuvers.json', import.meta.url).href);

/** The committed plans. */
export function loadPlannedManeuvers(): PlannedManeuver[] {
  return JSON.parse(readFileSync(plannedManeuversFile, 'utf8')) as PlannedManeuver[];
}
