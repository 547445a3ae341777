import { lazyScreen } from '@/components/shell/lazy-screen';

const CrewScreen = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.CrewScreen), 'Loading the crew…');

export default function CrewRoute() {
  return <CrewScreen />;
}
