import { useState } from 'react';
import { View } from 'react-native';

import { useRecordingQuery, useRecordingUploadMutation } from '@/components/api/use-recordings';
import { FilePicker } from '@/components/crew/FilePicker';
import { gaps } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { LoadingState } from '@/components/ui/LoadingState';

import { RecordingDetail } from './RecordingDetail';
import { UploadProblems } from './UploadProblems';

/** Upload a joint-angle CSV or a BVH recording, then review it (and its mapping) before using it in the composer. */
export function RecordingUploadPanel() {
  const [file, setFile] = useState<File | null>(null);
  const upload = useRecordingUploadMutation();
  const id = upload.data?.ok ? upload.data.recording.id : null;
  const detail = useRecordingQuery(id);
  return (
    <Card title="Recorded motion" subtitle="Joint-angle CSV (time_s + dof columns, degrees) or BVH motion capture">
      <View style={gaps.sm} testID="recording-upload">
        <FilePicker label="Recording file" accept=".csv,.bvh" onPick={setFile} />
        <Button label="Upload recording" icon="upload" size="sm" disabled={!file} loading={upload.isPending} onPress={() => file && upload.mutate(file)} testID="upload-recording" />
        <UploadProblems error={upload.error} outcome={upload.data} maxRows={30} />
        {id && detail.isPending ? <LoadingState label="Loading the recording…" /> : null}
        {detail.data ? <RecordingDetail recording={detail.data} /> : null}
      </View>
    </Card>
  );
}
