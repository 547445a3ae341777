import { useLocalSearchParams } from 'expo-router';

import { lazyScreen } from '@/components/shell/lazy-screen';

const RehearsalSession = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.RehearsalSession), 'Loading the rehearsal…');

/** One cleared maneuver: the full-screen 3D player, then the rehearsal log and history. */
export default function RehearseVersionScreen() {
  const { versionId } = useLocalSearchParams<{ versionId: string }>();
  return <RehearsalSession versionId={versionId} />;
}
