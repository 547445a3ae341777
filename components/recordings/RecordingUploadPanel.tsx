import { useState } from 'react';
import { View } from 'react-native';

import { errorMessage } from '@/components/api/client';
import { useRecordingQuery, useRecordingUploadMutation } from '@/components/api/use-recordings';
import { FilePicker } from '@/components/crew/FilePicker';
import { spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';

import { RecordingDetail } from './RecordingDetail';

/** Upload a joint-angle CSV or a BVH recording, then review it (and its mapping) before using it in the composer. */
export function RecordingUploadPanel() {
  const [file, setFile] = useState<File | null>(null);
  const upload = useRecordingUploadMutation();
  const id = upload.data?.ok ? upload.data.recording.id : null;
  const detail = useRecordingQuery(id);
  const rejected = upload.data && !upload.data.ok ? upload.data : null;
  return (
    <Card title="Recorded motion" subtitle="Joint-angle CSV (time_s + dof columns, degrees) or BVH motion capture">
      <View style={{ gap: spacing.sm }} testID="recording-upload">
        <FilePicker label="Recording file" accept=".csv,.bvh" onPick={setFile} />
        <Button label="Upload recording" icon="upload" size="sm" disabled={!file} loading={upload.isPending} onPress={() => file && upload.mutate(file)} testID="upload-recording" />
        {upload.isError ? <Text tone="danger" role="alert">{errorMessage(upload.error)}</Text> : null}
        {rejected ? (
          <View role="alert">
            <Text tone="danger">{rejected.message}</Text>
            {rejected.result.upload.errors.slice(0, 30).map((e, i) => (
              <Text key={i} variant="caption" tone="danger">{`${e.row > 0 ? `row ${e.row}` : 'file'}${e.column ? `, ${e.column}` : ''}: ${e.reason}`}</Text>
            ))}
          </View>
        ) : null}
        {id && detail.isPending ? <LoadingState label="Loading the recording…" /> : null}
        {detail.data ? <RecordingDetail recording={detail.data} /> : null}
      </View>
    </Card>
  );
}
