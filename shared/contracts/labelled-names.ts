/**
 * A closed list of names (roles, segments, dofs) with a display label for each, written once as
 * [name, label] pairs: a name cannot be listed without its label or labelled without being listed,
 * and the list keeps the order it is written in (the order screens and schemas use). No zod here,
 * so a screen can name things without shipping the zod runtime.
 */

type Pair = readonly [string, string];

/** The names, in order, a display label per name, and a guard for untyped input. */
export interface LabelledNames<P extends readonly Pair[]> {
  names: { readonly [K in keyof P]: P[K] extends readonly [infer N, string] ? N : never };
  labels: Readonly<Record<P[number][0], string>>;
  has: (name: string) => name is P[number][0];
}

export function labelledNames<const P extends readonly Pair[]>(pairs: P): LabelledNames<P> {
  const names = pairs.map(([name]) => name);
  const labels = Object.fromEntries(pairs) as Record<P[number][0], string>;
  return {
    names: names as LabelledNames<P>['names'],
    labels,
    has: (name: string): name is P[number][0] => Object.hasOwn(labels, name),
  };
}
