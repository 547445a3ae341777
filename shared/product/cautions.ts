/**
 * The cautions that apply to every maneuver (DESIGN.md "Cautions shown in the product"): one list,
 * so the screens and the printed cue card say the same thing.
 */
export const MANEUVER_CAUTIONS = [
  'A planning and training aid only: follow the program’s flight rules, tethering rules and certified procedures.',
  'Suited shoulder motion near its range limits is an injury risk: keep margins to the limits.',
  'Figures come from regression models of body segments and carry uncertainty: see the dispersion result before relying on a sequence.',
] as const;
