/**
 * The cautions printed on every cue card (DESIGN.md "Cautions shown in the product"), worded like
 * the app's maneuver cautions so paper and screen say the same thing.
 */

/** Caution lines, in print order. */
export const CUE_CARD_CAUTIONS: readonly string[] = [
  'A planning and training aid only: follow the program’s flight rules, tethering rules and certified procedures.',
  'Suited shoulder motion near its range limits is an injury risk: keep margins to the limits.',
  'Figures come from regression models of body segments and carry uncertainty: see the dispersion result before relying on a sequence.',
];
