import { useLocalSearchParams } from 'expo-router';

import type { ComposerPanel } from '@/components/maneuvers/Composer';
import { SequenceWorkspace } from '@/components/maneuvers/SequenceWorkspace';

const PANELS: readonly ComposerPanel[] = ['steps', 'report', 'versions'];

/** `/maneuvers/<sequenceId>?version=<versionId>&panel=report`: the composer, report and versions of one sequence. */
export default function SequenceRoute() {
  const { sequenceId, version, panel } = useLocalSearchParams<{ sequenceId: string; version?: string; panel?: string }>();
  const p = PANELS.find((x) => x === panel);
  return <SequenceWorkspace sequenceId={sequenceId} versionId={version || undefined} panel={p} />;
}
