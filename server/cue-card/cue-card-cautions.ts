/** The cautions printed on every cue card: the same list the app shows (shared/product/cautions.ts). */
import { MANEUVER_CAUTIONS } from '../../shared/product/cautions.ts';

/** Caution lines, in print order. */
export const CUE_CARD_CAUTIONS: readonly string[] = MANEUVER_CAUTIONS;
