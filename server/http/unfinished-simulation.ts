import { HttpError } from './http-error.ts';

/**
 * Recognises the engine's "the integrator could not finish" failure (the Magnus integrator gave up:
 * more steps than its limit, or a step size shrunk to nothing), by message rather than by class, so the mapping survives changes inside the
 * engine and errors that crossed a worker-thread boundary as text. Such a request is valid but
 * cannot be computed as asked: 422 naming the step, never a 500.
 */
const UNFINISHED = /did not converge|MaxStepsExceeded|max(?:imum)?[ _-]?steps/i;

/** 422 `simulation_unfinished` (field `sequence.steps.N` when the engine named the step), or null for any other error. */
export function unfinishedSimulation(err: unknown, fieldPrefix = 'sequence.steps'): HttpError | null {
  const message = err instanceof Error ? err.message : typeof err === 'string' ? err : '';
  if (!UNFINISHED.test(message)) return null;
  const step = /\bstep (\d+)/i.exec(message)?.[1];
  const where = step !== undefined ? `step ${step}` : 'one of the steps';
  return new HttpError(
    422,
    'simulation_unfinished',
    `The integrator could not finish ${where} within its step limit (${message}). Make the step slower or smoother, or loosen the tolerance.`,
    step !== undefined ? `${fieldPrefix}.${step}` : fieldPrefix,
  );
}
