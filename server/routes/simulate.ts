/**
 * POST / (mounted at /api/simulate): `{ body, sequence, options? }` → the simulation result.
 * Checks the envelope and size limits (the shared schema, through validate()) and the contracts on the request thread (cheap), then runs the simulation
 * in the worker pool under a time budget. Errors: `{ error: { code, message, field } }` (plus `issues`
 * listing every contract problem). Roles are enforced where the router is mounted.
 */
import { type NextFunction, type Request, type Response, Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { z } from 'zod';

import { validateBody } from '../../shared/contracts/body.ts';
import type { ContractIssue } from '../../shared/contracts/contract-issue.ts';
import { stepDuration, validateSequence } from '../../shared/contracts/sequence.ts';
import { DEFAULT_RATE_HZ, SIMULATE_LIMITS, simulateRequestSchema } from '../../shared/contracts/simulate-request.ts';
import { configSchema } from '../config.ts';
import { FairAdmission } from '../engine/pool/fair-admission.ts';
import { type SimulationPool, SimulationTimeoutError } from '../engine/pool/simulation-pool.ts';
import { unfinishedSimulation } from '../http/unfinished-simulation.ts';
import { validate } from '../http/validate.ts';

/** Fair-use limits of ad-hoc simulations (server/config.ts holds the defaults). */
export interface SimulateFairness {
  /** Simulations one person may have running or waiting at once. */
  perUser: number;
  /** Simulations one person may start per window. */
  rateLimit: number;
  rateWindowMs: number;
  /** Simulations allowed to wait for a worker, everyone together. */
  queueMax: number;
  /** Largest result: samples × dofs. */
  maxSampleValues: number;
}

/** The settings of server/config.ts the limits come from. */
const fairnessSettings = configSchema.pick({
  SIMULATE_CONCURRENCY_PER_USER: true, SIMULATE_RATE_LIMIT: true, SIMULATE_RATE_WINDOW_MS: true, SIMULATE_QUEUE_MAX: true, SIMULATE_MAX_SAMPLE_VALUES: true,
});

/** The limits from configuration. */
export function fairnessFromConfig(config: z.output<typeof fairnessSettings>): SimulateFairness {
  return {
    perUser: config.SIMULATE_CONCURRENCY_PER_USER, rateLimit: config.SIMULATE_RATE_LIMIT, rateWindowMs: config.SIMULATE_RATE_WINDOW_MS,
    queueMax: config.SIMULATE_QUEUE_MAX, maxSampleValues: config.SIMULATE_MAX_SAMPLE_VALUES,
  };
}

/** The configuration's own defaults (server/config.ts declares them once). */
const DEFAULT_FAIRNESS = fairnessFromConfig(fairnessSettings.parse({}));

/** Router settings. */
export interface SimulateRouterOptions {
  /** The pool to run on: the app context's ad-hoc pool (`ctx.simulation.adhoc`), never the one trainee motion uses. */
  pool: SimulationPool;
  /** Fair-use limits (unset ones take server/config.ts's defaults). */
  fairness?: Partial<SimulateFairness>;
}

function fail(res: Response, status: number, code: string, message: string, field?: string, issues?: ContractIssue[]) {
  res.status(status).json({ error: { code, message, ...(field ? { field } : {}), ...(issues ? { issues } : {}) } });
}

function contractFail(res: Response, which: 'body' | 'sequence', issues: ContractIssue[]) {
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more)` : '';
  fail(res, 400, `invalid_${which}`, `${which}: ${issues[0].message}${more}`, issues[0].path ? `${which}.${issues[0].path}` : which,
    issues.map((i) => ({ path: i.path ? `${which}.${i.path}` : which, message: i.message })));
}

/** Who is asking: the signed-in user, else the client address (bare routers in tests). */
const requester = (req: Request) => (req.user?.id ? `user:${req.user.id}` : `ip:${ipKeyGenerator(req.ip ?? '')}`);

/** Builds the router (tests pass their own pool and limits). */
export function createSimulateRouter(opts: SimulateRouterOptions): Router {
  const router = Router();
  const fair = { ...DEFAULT_FAIRNESS, ...opts.fairness };
  const { pool } = opts;
  const admission = new FairAdmission(pool, { perUser: fair.perUser, queueMax: fair.queueMax });

  const perUserRate = rateLimit({
    windowMs: fair.rateWindowMs,
    limit: fair.rateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    identifier: 'simulate',
    keyGenerator: requester,
    handler: (_req: Request, res: Response, _next: NextFunction, o: { windowMs: number }) => {
      fail(res, 429, 'rate_limited', `You started ${fair.rateLimit} simulations within ${Math.round(o.windowMs / 1000)} s, the most allowed; try again after the time in Retry-After.`);
    },
  });

  router.post('/', validate({ body: simulateRequestSchema }, { bodyError: 'invalid_request' }), perUserRate, async (req, res) => {
    const { body, sequence, options = {} } = req.body;
    // Contracts.
    const b = validateBody(body);
    if (!b.ok) return contractFail(res, 'body', b.issues);
    const s = validateSequence(sequence, b.value);
    if (!s.ok) return contractFail(res, 'sequence', s.issues);
    const duration = s.value.steps.reduce((t, st) => t + stepDuration(st), 0);
    if (duration > SIMULATE_LIMITS.maxDurationS) {
      return fail(res, 400, 'limit_exceeded', `sequence lasts ${duration.toFixed(1)} s; the limit is ${SIMULATE_LIMITS.maxDurationS} s`, 'sequence.steps');
    }
    // Response size: the samples dominate it (one angle per dof per sample). Refuse before running.
    const rateHz = options.rateHz ?? DEFAULT_RATE_HZ;
    const dofCount = Math.max(1, countDofs(b.value));
    const samples = Math.floor(duration * rateHz + 1e-9) + 1;
    if (samples * dofCount > fair.maxSampleValues) {
      const fitHz = Math.floor(((fair.maxSampleValues / dofCount) - 1) / Math.max(duration, 1e-9));
      const advice = fitHz >= SIMULATE_LIMITS.minRateHz ? `ask for at most ${fitHz} Hz (options.rateHz) for this ${duration.toFixed(1)} s sequence, or simulate a shorter one` : 'simulate a shorter sequence';
      return fail(res, 422, 'too_many_samples',
        `This simulation would return ${samples.toLocaleString('en')} samples × ${dofCount} dofs = ${(samples * dofCount).toLocaleString('en')} values; the limit is ${fair.maxSampleValues.toLocaleString('en')}. Ask for fewer samples: ${advice}.`,
        'options.rateHz');
    }
    // Fair use: one person cannot fill the ad-hoc pool, and its queue stays short.
    const who = requester(req);
    const refused = admission.enter(who);
    if (refused) {
      res.set('Retry-After', String(refused.retryAfterS));
      return fail(res, 429, refused.reason === 'per_user' ? 'simulation_in_progress' : 'simulations_busy', refused.reason === 'per_user'
        ? `You already have ${fair.perUser} simulation${fair.perUser > 1 ? 's' : ''} running; wait for it to finish (retry after ${refused.retryAfterS} s).`
        : `The simulation service is busy with other people's requests; retry after ${refused.retryAfterS} s.`);
    }
    // Simulate off the request thread.
    try {
      const reply = await pool.run(b.value, s.value, options);
      if (reply.kind === 'invalid') return contractFail(res, reply.which, reply.issues);
      res.json(reply.result);
    } catch (err) {
      if (err instanceof SimulationTimeoutError) return fail(res, 503, 'simulation_timeout', err.message);
      const unfinished = unfinishedSimulation(err);
      if (unfinished) return fail(res, unfinished.status, unfinished.code, unfinished.message, unfinished.field);
      return fail(res, 500, 'simulation_failed', `simulation failed: ${err instanceof Error ? err.message : String(err)}`);
    } finally {
      admission.leave(who);
    }
  });
  return router;
}

/** Joint dofs of a validated body. */
function countDofs(body: { segments: readonly { joint?: { dofs?: readonly unknown[] } | null }[] }): number {
  return body.segments.reduce((n, seg) => n + (seg.joint?.dofs?.length ?? 0), 0);
}
