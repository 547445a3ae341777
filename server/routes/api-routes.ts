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

/** One guarded API area: mounted at /api/<area>, open only to the roles ACCESS_POLICY[area] lists. */
export interface ApiArea {
  area: AccessArea;
  path: string;
  router: (ctx: AppContext) => Router;
}

/**
 * The router of every area of the access policy (typed by it, so an area without a router, or a
 * router without an area, does not compile). Mounted in this order; roles live in access-policy.ts.
 */
const AREA_ROUTERS: Record<AccessArea, (ctx: AppContext) => Router> = {
  me: meRouter, team: teamRouter, audit: auditRouter, jobs: jobsRouter, crew: crewRouter, suits: suitsRouter,
  uploads: uploadsRouter, motion: motionRouter, rehearsals: rehearsalsRouter, recordings: recordingsRouter,
  sequences: sequencesRouter, reviews: reviewsRouter,
  simulate: (ctx) => createSimulateRouter({ pool: ctx.simulation.adhoc, fairness: fairnessFromConfig(ctx.config) }),
};

/** Every signed-in API area, each at the path of its name. */
export const API_AREAS: ApiArea[] = (Object.keys(AREA_ROUTERS) as AccessArea[]).map((area) => ({ area, path: `/${area}`, router: AREA_ROUTERS[area] }));
