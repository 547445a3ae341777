/**
 * The `compiled` jsonb of a sequence version: `{ sequence, cues, stepMap }` — the engine sequence
 * contract, one cue per compiled step (read by the rehearsal view) and which primitive each step
 * came from.
 */
import type { StepOrigin } from '../../shared/primitives/compile-primitives.ts';

/** Stored compiled JSON. */
export interface StoredCompiled {
  /** Engine sequence contract { start, steps }. */
  sequence: { start: Record<string, number>; steps: unknown[] };
  /** One cue per compiled step (a blend carries "get ready: " + the next primitive's cue). */
  cues: string[];
  stepMap: StepOrigin[];
}

/** Reads stored compiled JSON (tolerating a bare sequence). */
export function storedCompiled(json: unknown): StoredCompiled {
  const c = (json ?? {}) as Partial<StoredCompiled> & { steps?: unknown[]; start?: Record<string, number> };
  if (c.sequence) return { sequence: c.sequence, cues: c.cues ?? [], stepMap: c.stepMap ?? [] };
  return { sequence: { start: c.start ?? {}, steps: c.steps ?? [] }, cues: [], stepMap: [] };
}
