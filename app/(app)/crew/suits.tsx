import { lazyScreen } from '@/components/shell/lazy-screen';

const SuitsScreen = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.SuitsScreen), 'Loading the suits…');

export default function CrewSuitsRoute() {
  return <SuitsScreen />;
}
