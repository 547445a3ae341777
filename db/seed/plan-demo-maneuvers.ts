/**
 * Makes the planner-made demo maneuvers (db/seed/planned-maneuvers.json) by running the planner on
 * the demo crew's current profiles: `npx tsx db/seed/plan-demo-maneuvers.ts`. The seed reads the
 * committed file instead of planning at seed time (a few seconds per plan); a test checks that
 * every stored plan still reaches its target on its body.
 */
import { writeFileSync } from 'node:fs';

import { deriveProfile } from '../../server/crew/derive-profile.ts';
import { BUILT_IN_SUITS } from '../../server/model/suits/index.ts';
import { planManeuver } from '../../server/planning/plan-maneuver.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import { PLANNED_DEMO_MANEUVERS, type PlannedManeuver, plannedManeuversFile, plannedTarget } from './planned-maneuvers.ts';
import { DEMO_PROFILES } from './seed-crew-profiles.ts';

/** The body of a demo crew member's current (newest) profile version. */
export function demoCurrentBody(crew: keyof typeof DEMO_PROFILES): Body {
  const versions = DEMO_PROFILES[crew];
  const v = versions[versions.length - 1];
  const suit = v.suit ? BUILT_IN_SUITS.find((s) => s.id === v.suit) ?? null : null;
  return deriveProfile({ lengths: {}, gear: [], ...v.inputs } as Parameters<typeof deriveProfile>[0], suit, String(crew)).body;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const out: PlannedManeuver[] = [];
  for (const m of PLANNED_DEMO_MANEUVERS) {
    const target = plannedTarget(m);
    const { candidates, notes } = planManeuver({ body: demoCurrentBody(m.crew), target, settings: planRequestSchema.parse({ samples: 50, maxCandidates: 2 }) });
    const best = candidates[0];
    if (!best?.withinTolerance) throw new Error(`${m.name}: no candidate within tolerance (${notes.join(' ')})`);
    out.push({ ...m, primitives: best.primitives, plannedErrorDeg: best.errorDeg, feedbackP95Deg: best.robustness.feedbackP95Deg });
    process.stderr.write(`${m.name}: ${best.errorDeg.toFixed(3)}°, ${best.durationS.toFixed(1)} s\n`);
  }
  writeFileSync(plannedManeuversFile, `${JSON.stringify(out, null, 1)}\n`);
}
