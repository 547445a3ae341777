/**
 * How robustness reads wherever a version is shown (report, review, lists, player, cue card on
 * screen and in the PDF): one wording per level (DECISIONS.md "Robustness"), so every place says
 * the same thing. Zod-free, so the player and the PDF renderer can import it.
 */
import type { JobState } from '../contracts/job-state.ts';
import type { RobustnessLevel } from '../contracts/robustness.ts';

/** Short label of a level. */
export const LEVEL_LABEL: Record<RobustnessLevel, string> = {
  robust: 'Robust',
  marginal: 'Marginal',
  not_robust: 'Not robust',
};

const deg = (v: number) => `${v.toFixed(1)}°`;

/**
 * The sentence for a finished run: what the 95th percentile with feedback means against the
 * tolerance, and for marginal and not robust the caution that goes with it.
 */
export function levelSentence(level: RobustnessLevel, feedbackP95Deg: number, toleranceDeg: number): string {
  if (level === 'robust') {
    return `Robust: with feedback, 95 % of simulated executions end within the ${deg(toleranceDeg)} tolerance (95th percentile ${deg(feedbackP95Deg)}).`;
  }
  if (level === 'marginal') {
    return `Caution, marginal: with feedback, 1 in 20 simulated executions ends more than ${deg(feedbackP95Deg)} off, beyond the ${deg(toleranceDeg)} tolerance (up to 3×). Rehearse with care and expect to trim with extra cycles.`;
  }
  return `Caution, not robust: with feedback, 1 in 20 simulated executions ends more than ${deg(feedbackP95Deg)} off, over 3× the ${deg(toleranceDeg)} tolerance. A small execution error spoils this maneuver; do not rely on it without re-planning.`;
}

/** What a sentence about a version's robustness needs (a list brief or a full record). */
export interface RobustnessFacts {
  state: JobState;
  /** 0–1. */
  progress: number;
  feedbackP95Deg: number | null;
  toleranceDeg: number;
  level: RobustnessLevel | null;
}

/** The sentence for a version's robustness in any state (null: never computed). */
export function robustnessSentence(r: RobustnessFacts | null): string {
  if (!r) return 'Robustness not computed for this version: how reliably a person lands it is unknown.';
  if (r.state === 'done' && r.level && r.feedbackP95Deg !== null) return levelSentence(r.level, r.feedbackP95Deg, r.toleranceDeg);
  if (r.state === 'queued') return 'Robustness run queued: how reliably a person lands this version is not known yet.';
  if (r.state === 'running') return `Robustness run in progress (${Math.round(r.progress * 100)} %): how reliably a person lands this version is not known yet.`;
  return `Robustness run ${r.state}: how reliably a person lands this version is unknown until it is run again.`;
}
