/**
 * Request body of POST /api/simulate: `{ body, sequence, options? }`, with the size limits the API
 * enforces before any simulation runs.
 */
import { z } from 'zod';

/** Limits on what one simulation request may ask for. */
export const SIMULATE_LIMITS = {
  /** Max segments in a body. */
  maxSegments: 64,
  /** Max dofs in a body. */
  maxDofs: 200,
  /** Max steps in a sequence. */
  maxSteps: 500,
  /** Max total sequence duration, seconds. */
  maxDurationS: 600,
  /** Sample rate bounds, Hz. */
  minRateHz: 1,
  maxRateHz: 240,
  /** Relative tolerance bounds of the integrator. */
  minRtol: 1e-13,
  maxRtol: 1e-3,
} as const;

/** Default sample rate, Hz. */
export const DEFAULT_RATE_HZ = 60;
/** Default relative (and absolute) integrator tolerance. */
export const DEFAULT_RTOL = 1e-10;

/** Simulation options. */
export const simulateOptionsSchema = z.object({
  /** Sample rate for the 3D view, Hz. */
  rateHz: z.number().min(SIMULATE_LIMITS.minRateHz, `rateHz must be at least ${SIMULATE_LIMITS.minRateHz} Hz`)
    .max(SIMULATE_LIMITS.maxRateHz, `rateHz must be at most ${SIMULATE_LIMITS.maxRateHz} Hz`).optional(),
  /** Relative tolerance of the adaptive integrator. */
  rtol: z.number().min(SIMULATE_LIMITS.minRtol, `rtol must be at least ${SIMULATE_LIMITS.minRtol}`)
    .max(SIMULATE_LIMITS.maxRtol, `rtol must be at most ${SIMULATE_LIMITS.maxRtol}`).optional(),
}).strict();
/** Simulation options. */
export type SimulateOptions = z.infer<typeof simulateOptionsSchema>;

const LIMIT = { code: 'limit_exceeded' } as const;
const listOf = (v: unknown, key: string): unknown[] | null => {
  const list = (v as Record<string, unknown>)[key];
  return Array.isArray(list) ? list : null;
};
const dofCount = (segments: unknown[]) => segments.reduce<number>((n, s) => {
  const dofs = typeof s === 'object' && s !== null ? (s as { joint?: { dofs?: unknown } }).joint?.dofs : undefined;
  return n + (Array.isArray(dofs) ? dofs.length : 0);
}, 0);

/**
 * Envelope of the request, with the size limits (issue code `limit_exceeded`) checked before any
 * deep validation; `body` and `sequence` themselves are checked by validateBody / validateSequence.
 */
export const simulateRequestSchema = z.object({
  body: z.record(z.string(), z.unknown(), { error: 'body is required (an object)' }),
  sequence: z.record(z.string(), z.unknown(), { error: 'sequence is required (an object)' }),
  options: simulateOptionsSchema.optional(),
}).superRefine(({ body, sequence }, ctx) => {
  const segments = listOf(body, 'segments');
  if (segments && segments.length > SIMULATE_LIMITS.maxSegments) {
    ctx.addIssue({ code: 'custom', path: ['body', 'segments'], params: LIMIT, message: `body has ${segments.length} segments; the limit is ${SIMULATE_LIMITS.maxSegments}` });
  } else if (segments && dofCount(segments) > SIMULATE_LIMITS.maxDofs) {
    ctx.addIssue({ code: 'custom', path: ['body', 'segments'], params: LIMIT, message: `body has ${dofCount(segments)} dofs; the limit is ${SIMULATE_LIMITS.maxDofs}` });
  }
  const steps = listOf(sequence, 'steps');
  if (steps && steps.length > SIMULATE_LIMITS.maxSteps) {
    ctx.addIssue({ code: 'custom', path: ['sequence', 'steps'], params: LIMIT, message: `sequence has ${steps.length} steps; the limit is ${SIMULATE_LIMITS.maxSteps}` });
  }
});
/** The request body. */
export type SimulateRequest = z.infer<typeof simulateRequestSchema>;
