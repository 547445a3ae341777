import type { Router } from 'express';

import type { AppContext } from '../app-context.ts';
import type { AccessArea } from '../auth/access-policy.ts';
import { auditRouter } from './audit.ts';
import { meRouter } from './auth.ts';
import { crewRouter } from './crew.ts';
import { jobsRouter } from './jobs.ts';
import { motionRouter } from './motion.ts';
import { recordingsRouter } from './recordings.ts';
import { rehearsalsRouter } from './rehearsals.ts';
import { reviewsRouter } from './reviews.ts';
import { sequencesRouter } from './sequences.ts';
import { createSimulateRouter, fairnessFromConfig } from './simulate.ts';
import { suitsRouter } from './suits.ts';
import { teamRouter } from './team.ts';
import { uploadsRouter } from './uploads.ts';

/** One guarded API area: mounted at /api/<path>, open only to the roles ACCESS_POLICY[area] lists. */
export interface ApiArea {
  area: AccessArea;
  path: string;
  router: (ctx: AppContext) => Router;
}

/** Every signed-in API area. Add a line here when adding an area; roles live in access-policy.ts. */
export const API_AREAS: ApiArea[] = [
  { area: 'me', path: '/me', router: meRouter },
  { area: 'team', path: '/team', router: teamRouter },
  { area: 'audit', path: '/audit', router: auditRouter },
  { area: 'jobs', path: '/jobs', router: jobsRouter },
  { area: 'crew', path: '/crew', router: crewRouter },
  { area: 'suits', path: '/suits', router: suitsRouter },
  { area: 'uploads', path: '/uploads', router: uploadsRouter },
  { area: 'motion', path: '/motion', router: motionRouter },
  { area: 'rehearsals', path: '/rehearsals', router: rehearsalsRouter },
  { area: 'recordings', path: '/recordings', router: recordingsRouter },
  { area: 'sequences', path: '/sequences', router: sequencesRouter },
  { area: 'reviews', path: '/reviews', router: reviewsRouter },
  {
    area: 'simulate', path: '/simulate',
    router: (ctx) => createSimulateRouter({
      pool: ctx.simulation.adhoc,
      fairness: fairnessFromConfig(ctx.config),
    }),
  },
];
