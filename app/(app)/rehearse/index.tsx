import { lazyScreen } from '@/components/shell/lazy-screen';

const RehearseScreen = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.RehearseScreen), 'Loading your maneuvers…');

/** Rehearse tab: the trainee's cleared maneuvers with target, duration and last rehearsal. */
export default function RehearseRoute() {
  return <RehearseScreen />;
}
