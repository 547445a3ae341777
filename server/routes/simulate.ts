/**
 * POST / (mounted at /api/simulate): `{ body, sequence, options? }` → the simulation result.
 * Checks the size limits and the contracts on the request thread (cheap), then runs the simulation
 * in the worker pool under a time budget. Errors: `{ error: { code, message, field } }` (plus `issues`
 * listing every contract problem). Roles are enforced where the router is mounted.
 */
import { type Request, type Response, Router } from 'express';
import { validateBody } from '../../shared/contracts/body.ts';
import type { ContractIssue } from '../../shared/contracts/contract-issue.ts';
import { stepDuration, validateSequence } from '../../shared/contracts/sequence.ts';
import { formatPath } from '../../shared/contracts/contract-issue.ts';
import { SIMULATE_LIMITS, simulateRequestSchema } from '../../shared/contracts/simulate-request.ts';
import { SimulationPool, SimulationTimeoutError } from '../engine/pool/simulation-pool.ts';

/** Router settings. */
export interface SimulateRouterOptions {
  /** The pool to run on (default: one shared pool created on first use). */
  pool?: SimulationPool;
}

let sharedPool: SimulationPool | null = null;
/** The process-wide simulation pool (created on first use; 20 s budget per simulation). */
export function defaultSimulationPool(): SimulationPool {
  sharedPool ??= new SimulationPool({ timeoutMs: 20_000 });
  return sharedPool;
}

function fail(res: Response, status: number, code: string, message: string, field?: string, issues?: ContractIssue[]) {
  res.status(status).json({ error: { code, message, ...(field ? { field } : {}), ...(issues ? { issues } : {}) } });
}

function contractFail(res: Response, which: 'body' | 'sequence', issues: ContractIssue[]) {
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more)` : '';
  fail(res, 400, `invalid_${which}`, `${which}: ${issues[0].message}${more}`, issues[0].path ? `${which}.${issues[0].path}` : which,
    issues.map((i) => ({ path: i.path ? `${which}.${i.path}` : which, message: i.message })));
}

/** Builds the router (tests pass their own pool). */
export function createSimulateRouter(opts: SimulateRouterOptions = {}): Router {
  const router = Router();
  router.post('/', async (req: Request, res: Response) => {
    // Envelope and options.
    const env = simulateRequestSchema.safeParse(req.body);
    if (!env.success) {
      const issue = env.error.issues[0];
      const field = formatPath(issue.path) || 'request';
      return fail(res, 400, 'invalid_request', `${field}: ${issue.message}`, field);
    }
    const { body, sequence, options = {} } = env.data;
    // Size limits first, so huge inputs are not validated in depth.
    const segs = (body as { segments?: unknown }).segments;
    if (Array.isArray(segs)) {
      if (segs.length > SIMULATE_LIMITS.maxSegments) {
        return fail(res, 400, 'limit_exceeded', `body has ${segs.length} segments; the limit is ${SIMULATE_LIMITS.maxSegments}`, 'body.segments');
      }
      const dofs = segs.reduce((n: number, s: { joint?: { dofs?: unknown } }) => n + (Array.isArray(s?.joint?.dofs) ? s.joint.dofs.length : 0), 0);
      if (dofs > SIMULATE_LIMITS.maxDofs) {
        return fail(res, 400, 'limit_exceeded', `body has ${dofs} dofs; the limit is ${SIMULATE_LIMITS.maxDofs}`, 'body.segments');
      }
    }
    const steps = (sequence as { steps?: unknown }).steps;
    if (Array.isArray(steps) && steps.length > SIMULATE_LIMITS.maxSteps) {
      return fail(res, 400, 'limit_exceeded', `sequence has ${steps.length} steps; the limit is ${SIMULATE_LIMITS.maxSteps}`, 'sequence.steps');
    }
    // Contracts.
    const b = validateBody(body);
    if (!b.ok) return contractFail(res, 'body', b.issues);
    const s = validateSequence(sequence, b.value);
    if (!s.ok) return contractFail(res, 'sequence', s.issues);
    const duration = s.value.steps.reduce((t, st) => t + stepDuration(st), 0);
    if (duration > SIMULATE_LIMITS.maxDurationS) {
      return fail(res, 400, 'limit_exceeded', `sequence lasts ${duration.toFixed(1)} s; the limit is ${SIMULATE_LIMITS.maxDurationS} s`, 'sequence.steps');
    }
    // Simulate off the request thread.
    try {
      const reply = await (opts.pool ?? defaultSimulationPool()).run(b.value, s.value, options);
      if (reply.kind === 'invalid') return contractFail(res, reply.which, reply.issues);
      res.json(reply.result);
    } catch (err) {
      if (err instanceof SimulationTimeoutError) return fail(res, 503, 'simulation_timeout', err.message);
      return fail(res, 500, 'simulation_failed', `simulation failed: ${err instanceof Error ? err.message : String(err)}`);
    }
  });
  return router;
}

/** The router with the shared pool, to mount at /api/simulate. */
export const simulateRouter: Router = createSimulateRouter();
