/**
 * Whether a planner suggestion meets the sequence's limits (the ranking's first rule, DECISIONS.md
 * "Planner ranking"), and which it misses in a word each: one rule for the planner, its cards and
 * the side-by-side table. Zod-free (types only).
 */
import type { PlanCandidate } from '../contracts/plan.ts';

type LimitFigures = Pick<PlanCandidate, 'withinTolerance' | 'withinRateLimit' | 'rangeViolationCount' | 'withinTimeBudget'>;

/** Meets tolerance, ranges, rate limit and time budget. */
export function meetsLimits(c: LimitFigures): boolean {
  return c.withinTolerance && c.withinRateLimit && c.rangeViolationCount === 0 && c.withinTimeBudget;
}

/** The limits missed, a word each ("tolerance", "ranges", "rate", "time"); empty when all are met. */
export function missedLimitWords(c: LimitFigures): string[] {
  const out: string[] = [];
  if (!c.withinTolerance) out.push('tolerance');
  if (c.rangeViolationCount) out.push('ranges');
  if (!c.withinRateLimit) out.push('rate');
  if (!c.withinTimeBudget) out.push('time');
  return out;
}
