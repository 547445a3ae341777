import type { Sequence } from '../../shared/contracts/sequence.ts';
import { storedCompiled } from '../maneuvers/stored-compiled.ts';
import { stepTimeline } from './step-timeline.ts';

/**
 * The compiled sequence of a version as stored: either the engine sequence contract itself
 * (`{ start, steps }`) or that contract wrapped as `{ sequence, cues? }` with one cue per step.
 */

/** The engine sequence JSON (unvalidated) and the per-step cues found beside it. */
export interface CompiledParts {
  sequence: unknown;
  cues: (string | undefined)[];
}

/** Splits stored compiled JSON into the sequence contract and optional cues. */
export function compiledParts(compiled: unknown): CompiledParts {
  if (compiled && typeof compiled === 'object' && !Array.isArray(compiled)) {
    const c = compiled as Record<string, unknown>;
    if ('sequence' in c && !('steps' in c)) {
      const cues = Array.isArray(c.cues) ? c.cues.map((x) => (typeof x === 'string' ? x : undefined)) : [];
      return { sequence: c.sequence, cues };
    }
  }
  return { sequence: compiled, cues: [] };
}

/**
 * Number of steps as the composer lists them (DECISIONS.md "Steps"): the primitives named by the
 * stored step map, or, without one, the compiled steps less the joining moves that become lead-ins
 * (the same grouping as the player's step list). 0 when unreadable.
 */
export function stepListCount(compiled: unknown): number {
  const stepMap = storedCompiled(compiled).stepMap;
  if (stepMap.length) return new Set(stepMap.map((o) => o.primitive)).size;
  const parts = compiledParts(compiled);
  const seq = parts.sequence as { steps?: unknown };
  if (!Array.isArray(seq?.steps) || compiledDuration(compiled) <= 0) return compiledStepCount(compiled);
  try {
    return stepTimeline(parts.sequence as Sequence, parts.cues).length;
  } catch {
    return compiledStepCount(compiled);
  }
}

/** Number of compiled (engine) steps in stored compiled JSON (0 when unreadable). */
export function compiledStepCount(compiled: unknown): number {
  const seq = compiledParts(compiled).sequence as { steps?: unknown };
  return Array.isArray(seq?.steps) ? seq.steps.length : 0;
}

/** Total duration (s) of stored compiled JSON, summing step durations; 0 when unreadable. */
export function compiledDuration(compiled: unknown): number {
  const seq = compiledParts(compiled).sequence as { steps?: unknown };
  if (!Array.isArray(seq?.steps)) return 0;
  let t = 0;
  for (const s of seq.steps as Record<string, unknown>[]) {
    if (s?.kind === 'harmonic' && typeof s.cycles === 'number' && typeof s.period === 'number') t += s.cycles * s.period;
    else if (s?.kind === 'track' && Array.isArray(s.frames) && typeof s.rateHz === 'number' && s.rateHz > 0) t += (s.frames.length - 1) / s.rateHz;
    else if (typeof s?.duration === 'number') t += s.duration;
  }
  return t;
}
