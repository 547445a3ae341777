import { useLocalSearchParams } from 'expo-router';

import type { ComposerPanel } from '@/components/maneuvers/Composer';
import { lazyScreen } from '@/components/shell/lazy-screen';

// The composer, report charts and version history load with the signed-in screens, not on sign-in.
const SequenceWorkspace = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.SequenceWorkspace), 'Loading the composer…');

const PANELS: readonly ComposerPanel[] = ['steps', 'report', 'versions'];

/** `/maneuvers/<sequenceId>?version=<versionId>&panel=report`: the composer, report and versions of one sequence. */
export default function SequenceRoute() {
  const { sequenceId, version, panel } = useLocalSearchParams<{ sequenceId: string; version?: string; panel?: string }>();
  const p = PANELS.find((x) => x === panel);
  return <SequenceWorkspace sequenceId={sequenceId} versionId={version || undefined} panel={p} />;
}
