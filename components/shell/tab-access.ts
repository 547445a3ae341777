import type { IconName } from '@/components/ui/Icon';
import type { Role } from '@/shared/contracts/roles';

/** The signed-in tabs, in tab-bar order. Each name is a route folder under app/(app)/. */
export const TAB_NAMES = ['rehearse', 'crew', 'maneuvers', 'reviews', 'team'] as const;
/** One tab's route name. */
export type TabName = (typeof TAB_NAMES)[number];

/** Label, icon and the roles that see each tab (the server enforces the same split per API area). */
export const TABS: Record<TabName, { title: string; icon: IconName; roles: readonly Role[] }> = {
  rehearse: { title: 'Rehearse', icon: 'play-circle', roles: ['trainee'] },
  crew: { title: 'Crew', icon: 'users', roles: ['admin', 'planner', 'reviewer', 'trainee'] },
  maneuvers: { title: 'Maneuvers', icon: 'rotate-cw', roles: ['admin', 'planner', 'reviewer'] },
  reviews: { title: 'Reviews', icon: 'check-square', roles: ['admin', 'reviewer'] },
  team: { title: 'Team', icon: 'shield', roles: ['admin'] },
};

/** Whether a role sees a tab. */
export function canSeeTab(role: Role, tab: TabName): boolean {
  return TABS[tab].roles.includes(role);
}

/** Where each role's work starts: a reviewer's is the review queue, not the first tab in the bar. */
const HOME_TAB: Partial<Record<Role, TabName>> = { reviewer: 'reviews' };

/** The tab a role lands on after signing in. */
export function homeTab(role: Role): TabName {
  return HOME_TAB[role] ?? TAB_NAMES.find((t) => canSeeTab(role, t)) ?? 'crew';
}
