import { useRouter } from 'expo-router';

import { useSessionQuery } from '@/components/api/use-session';
import { RecordingUploadPanel } from '@/components/recordings/RecordingUploadPanel';
import { Button } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';
import { Screen } from '@/components/ui/Screen';

import { UploadPanel } from './UploadPanel';

/** The Crew tab's upload page (planners and admins). */
export function UploadScreen() {
  const router = useRouter();
  const session = useSessionQuery();
  const role = session.data?.role;
  const allowed = role === 'planner' || role === 'admin';
  return (
    <Screen
      title="Upload measurements"
      subtitle="Import several crew members from a CSV, or replace one member's regression with a measured segment table"
      actions={<Button label="Back to crew" icon="chevron-left" size="sm" variant="secondary" onPress={() => router.replace('/crew')} />}
    >
      {allowed ? <UploadPanel /> : null}
      {allowed ? <RecordingUploadPanel /> : null}
      {allowed ? null : <EmptyState icon="lock" title="Planners upload measurements" body="Your role reads crew profiles but does not import them." />}
    </Screen>
  );
}
