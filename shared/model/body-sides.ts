/**
 * The standard model's two sides: a limb's segments and dofs are named `l_…` and `r_…` and mirror
 * each other, so a limb is described once and named here for both sides.
 */

export type Side = 'l' | 'r';

/** A side's name for a limb part: `l_upper_arm` for ('l', 'upper_arm'). */
export type Sided<S extends string> = `${Side}_${S}`;

const SIDE_WORDS: Record<Side, string> = { l: 'Left', r: 'Right' };

/**
 * [name, label] pairs for a limb chain on both sides, the whole left chain first and then the
 * right one (the order the body tree lists them): ('upper_arm', 'upper arm') gives
 * ['l_upper_arm', 'Left upper arm'] … ['r_upper_arm', 'Right upper arm'] ….
 */
export function limbOnBothSides<const S extends string>(chain: readonly (readonly [S, string])[]): [Sided<S>, string][] {
  return (['l', 'r'] as const).flatMap((side) => chain.map(([part, label]): [Sided<S>, string] => [`${side}_${part}`, `${SIDE_WORDS[side]} ${label}`]));
}

/** The same value on each side: { foot: v } gives { l_foot: v, r_foot: copy of v } (left before right, part by part). */
export function sameOnBothSides<const S extends string, V>(perPart: Record<S, V>): Record<Sided<S>, V> {
  const out: Partial<Record<Sided<S>, V>> = {};
  for (const part of Object.keys(perPart) as S[]) {
    out[`l_${part}`] = perPart[part];
    // A copy, so that changing one side's value later never changes the other's.
    out[`r_${part}`] = structuredClone(perPart[part]);
  }
  return out as Record<Sided<S>, V>;
}
