import { Badge, type BadgeProps } from './Badge';

/** How each state of a set looks as a badge: its words, tone and (optionally) icon. */
export type StateLooks<S extends string> = Readonly<Record<S, BadgeProps>>;

/** Props of {@link StateBadge}. */
export interface StateBadgeProps<S extends string> {
  looks: StateLooks<S>;
  state: S;
  /** Other words for this state where a screen says more (the tone and icon stay the state's). */
  label?: string;
}

/** One state of a set (a version's status, a job's state, a review decision) in the one look its table gives it. */
export function StateBadge<S extends string>({ looks, state, label }: StateBadgeProps<S>) {
  const look = looks[state];
  return <Badge label={label ?? look.label} tone={look.tone} icon={look.icon} />;
}
