import { lazyScreen } from '@/components/shell/lazy-screen';

const TeamScreen = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.TeamScreen), 'Loading the team…');

export default function TeamRoute() {
  return <TeamScreen />;
}
