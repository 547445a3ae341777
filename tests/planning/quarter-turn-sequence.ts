import { expect } from 'vitest';

import type { SequenceSummary } from '../../shared/contracts/maneuver.ts';
import { as, crewOf, PEOPLE } from '../maneuvers/maneuver-api.ts';
import { bodyOf } from '../support/response-body.ts';
import type { TestApp } from '../support/test-app.ts';

/** Creates, as the demo planner, a sequence for the demo trainee's crew member targeting yaw 90° within 2°; returns its id. */
export async function createQuarterTurnSequence(t: TestApp, name: string): Promise<string> {
  const crew = await crewOf(t, PEOPLE.trainee);
  const res = await as(t, PEOPLE.planner).post('/sequences', {
    crewMemberId: crew, name, target: { mode: 'ypr', yprDeg: { yaw: 90, pitch: 0, roll: 0 }, toleranceDeg: 2 },
  });
  expect(res.status).toBe(201);
  return bodyOf<SequenceSummary>(res).id;
}
