import { View } from 'react-native';

import type { UploadOutcome } from '@/components/api/use-uploads';
import { gaps } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { type DataColumn, DataTable } from '@/components/ui/DataTable';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Text } from '@/components/ui/Text';
import type { ImportedRowResult, UploadRowError } from '@/shared/contracts/uploads';

const ERROR_COLUMNS: DataColumn<UploadRowError>[] = [
  { header: 'Row', cell: (e) => (e.row > 0 ? String(e.row) : 'file'), numeric: true, minWidth: 50, flex: 0 },
  { header: 'Column', cell: (e) => <Text variant="label">{e.column || '—'}</Text>, minWidth: 86, flex: 1 },
  { header: 'Problem', cell: (e) => <Text>{e.reason}</Text>, minWidth: 150, flex: 3 },
];

const IMPORTED_COLUMNS: DataColumn<ImportedRowResult>[] = [
  { header: 'Row', cell: (r) => (r.row > 0 ? String(r.row) : '—'), numeric: true, minWidth: 40, flex: 0 },
  { header: 'Crew member', cell: (r) => <Text variant="label">{r.name}</Text>, minWidth: 110, flex: 2 },
  { header: 'Result', cell: (r) => <Badge label={r.action === 'created' ? 'New member' : 'New version'} tone={r.action === 'created' ? 'teal' : 'accent'} />, minWidth: 104 },
  { header: 'Ver.', cell: (r) => `v${r.version}`, numeric: true, minWidth: 48, flex: 0 },
];

/** What an upload did: the imported rows, or every row error of a rejected file (nothing imported). */
export function UploadResultView({ outcome }: { outcome: UploadOutcome }) {
  const { upload, imported } = outcome.result;
  if (!outcome.ok) {
    return (
      <View style={gaps.md}>
        <ErrorBanner title="Nothing was imported" error={`${upload.errors.length} problem${upload.errors.length === 1 ? '' : 's'} in ${new Set(upload.errors.map((e) => e.row)).size} row${new Set(upload.errors.map((e) => e.row)).size === 1 ? '' : 's'}: every one is listed below.`} />
        <DataTable label="Upload errors" columns={ERROR_COLUMNS} rows={upload.errors} rowKey={(e) => `${e.row}-${e.column}-${e.reason}`} rowTone={() => 'danger'} />
        <Text variant="caption" tone="muted">
          The file is kept as uploaded ({upload.objectKey}) for the record. Fix the rows above and upload it again.
        </Text>
      </View>
    );
  }
  return (
    <View style={gaps.md}>
      <View role="status">
        <Text tone="success" variant="bodyStrong">
          Imported {imported.length} row{imported.length === 1 ? '' : 's'} from {upload.fileName}.
        </Text>
      </View>
      <DataTable label="Imported rows" columns={IMPORTED_COLUMNS} rows={imported} rowKey={(r) => `${r.row}-${r.crewMemberId}`} />
    </View>
  );
}
