import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { ApiError } from '@/components/api/client';
import { useUpdateSuitMutation } from '@/components/api/use-suits';
import { formatDateTime } from '@/components/format/date-time';
import { colors, fonts, gaps, radii, spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { type DataColumn, DataTable } from '@/components/ui/DataTable';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Text } from '@/components/ui/Text';
import type { SuitView } from '@/shared/contracts/crew';
import { suitConfigSchema } from '@/shared/contracts/suit';
import { DOF_LABELS, DOF_NAMES,type DofName } from '@/shared/model/dof-names';
import { SEGMENT_LABELS, SEGMENT_NAMES, type SegmentName } from '@/shared/model/segment-names';

import { fixed } from './format-values';

/** "segments.l_thigh.mass: …" from a zod issue path and message. */
function issueText(path: readonly PropertyKey[], message: string): string {
  return `${path.map(String).join('.') || '(configuration)'}: ${message}`;
}

const ADDED_MASS_COLUMNS: DataColumn<{ seg: SegmentName; mass: number }>[] = [
  { header: 'Segment', cell: (r) => <Text variant="label">{SEGMENT_LABELS[r.seg] ?? r.seg}</Text>, minWidth: 150 },
  { header: 'Added mass (kg)', cell: (r) => fixed(r.mass, 2), numeric: true, minWidth: 110 },
];

const SUITED_RANGE_COLUMNS: DataColumn<{ dof: DofName; min: number; max: number }>[] = [
  { header: 'Joint (suited range)', cell: (r) => <Text variant="label">{DOF_LABELS[r.dof] ?? r.dof}</Text>, minWidth: 200 },
  { header: 'Min (°)', cell: (r) => fixed(r.min, 0), numeric: true, minWidth: 70 },
  { header: 'Max (°)', cell: (r) => fixed(r.max, 0), numeric: true, minWidth: 70 },
];

/**
 * One suit configuration: added mass per segment, suited ranges and locked dofs; planners edit it as
 * JSON (checked against the shared suit schema before sending, and again by the server).
 */
export function SuitCard({ suit, canEdit }: { suit: SuitView; canEdit: boolean }) {
  const c = suit.config;
  const [draft, setDraft] = useState<string | null>(null);
  // The stored version the draft started from (kept while the list refetches underneath).
  const [baseVersion, setBaseVersion] = useState(suit.version);
  const [problem, setProblem] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const update = useUpdateSuitMutation();
  // Body order (stored JSON comes back with its keys reordered).
  const added = SEGMENT_NAMES.filter((seg) => c.segments[seg]).map((seg) => ({ seg, mass: c.segments[seg]?.mass ?? 0 }));
  const total = added.reduce((s, a) => s + a.mass, 0);
  const ranges = DOF_NAMES.filter((dof) => c.ranges[dof]).map((dof) => ({ dof, min: c.ranges[dof]?.min ?? 0, max: c.ranges[dof]?.max ?? 0 }));

  const save = () => {
    setProblem(null);
    let json: unknown;
    try {
      json = JSON.parse(draft ?? '');
    } catch (err) {
      setProblem(`Not valid JSON: ${(err as Error).message}`);
      return;
    }
    const parsed = suitConfigSchema.safeParse(json);
    if (!parsed.success) {
      const i = parsed.error.issues[0];
      setProblem(issueText(i.path, i.message));
      return;
    }
    update.mutate({ id: suit.id, config: parsed.data, baseVersion }, {
      onSuccess: () => setDraft(null),
      onError: (e) => {
        setStale(e instanceof ApiError && e.code === 'stale_version');
        setProblem(e instanceof ApiError ? e.message : String(e));
      },
    });
  };
  const startEdit = () => {
    setBaseVersion(suit.version);
    setDraft(JSON.stringify(c, null, 2));
    setProblem(null);
    setStale(false);
  };

  return (
    <Card
      title={c.name}
      subtitle={`id ${c.id} · version ${suit.version} · adds ${fixed(total, 2)} kg · edited ${formatDateTime(suit.updatedAt)}${suit.updatedByName ? ` by ${suit.updatedByName}` : ''}`}
      trailing={c.illustrative ? <Badge label="Illustrative values" tone="accent" /> : <Badge label="Measured" tone="success" />}
    >
      <View style={gaps.md}>
        {c.note ? <Text tone="muted">{c.note}</Text> : null}
        {added.length ? (
          <DataTable label={`${c.name}: added mass`} columns={ADDED_MASS_COLUMNS} rows={added} rowKey={(r) => r.seg} />
        ) : null}
        {ranges.length ? (
          <DataTable label={`${c.name}: suited ranges`} columns={SUITED_RANGE_COLUMNS} rows={ranges} rowKey={(r) => r.dof} />
        ) : (
          <Text variant="caption" tone="muted">Unsuited joint ranges apply.</Text>
        )}
        {c.lockedDofs.length ? <Text variant="caption" tone="muted">Locked: {c.lockedDofs.map((d) => DOF_LABELS[d] ?? d).join(', ')}</Text> : null}

        {canEdit && draft === null ? <Button label="Edit as JSON" icon="edit-3" variant="secondary" size="sm" onPress={startEdit} /> : null}
        {draft !== null ? (
          <View style={gaps.md}>
            <Text variant="caption" tone="muted">
              Masses in kg, positions in m in the segment frame, inertia in kg·m², ranges in degrees. Saved profile versions keep their own copy; only later saves use the edit.
            </Text>
            <textarea
              aria-label={`${c.name} configuration JSON`}
              value={draft}
              onChange={(e) => setDraft(e.target.value)}
              rows={16}
              spellCheck={false}
              style={{
                fontFamily: fonts.regular, fontSize: 13, color: colors.text, backgroundColor: colors.background,
                border: `1px solid ${problem ? colors.danger : colors.border}`, borderRadius: radii.md, padding: spacing.sm, colorScheme: 'dark',
              }}
            />
            <ErrorBanner error={problem} />
            <View style={styles.row}>
              {stale ? (
                // Someone saved in between: start again from their version (the draft is replaced).
                <Button label={`Load version ${suit.version}`} icon="refresh-cw" size="sm" onPress={startEdit} disabled={suit.version === baseVersion} />
              ) : (
                <Button label="Save suit" icon="save" size="sm" loading={update.isPending} onPress={save} />
              )}
              <Button label="Cancel" size="sm" variant="secondary" onPress={() => { setDraft(null); setProblem(null); setStale(false); }} />
            </View>
          </View>
        ) : null}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: spacing.sm },
});
