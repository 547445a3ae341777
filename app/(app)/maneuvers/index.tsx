import { lazyScreen } from '@/components/shell/lazy-screen';

const ManeuversScreen = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.ManeuversScreen), 'Loading the maneuvers…');

/** `/maneuvers`: every sequence with its status, search and "new maneuver". */
export default function ManeuversIndex() {
  return <ManeuversScreen />;
}
