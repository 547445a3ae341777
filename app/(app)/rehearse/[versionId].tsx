import { useLocalSearchParams } from 'expo-router';

import { RehearsalSession } from '@/components/rehearse/RehearsalSession';

/** One cleared maneuver: the full-screen 3D player, then the rehearsal log and history. */
export default function RehearseVersionScreen() {
  const { versionId } = useLocalSearchParams<{ versionId: string }>();
  return <RehearsalSession versionId={versionId} />;
}
