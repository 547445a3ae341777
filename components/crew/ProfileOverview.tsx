import { StyleSheet, View } from 'react-native';

import { formatDateTime } from '@/components/format/date-time';
import { colors, gaps, spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Card } from '@/components/ui/Card';
import { type DataColumn, DataTable } from '@/components/ui/DataTable';
import { Figure as LabelledFigure, type FigureProps } from '@/components/ui/Figure';
import { Text } from '@/components/ui/Text';
import type { ProfileVersionView, SegmentSummary } from '@/shared/contracts/profile-version';
import { SEGMENT_LABELS, type SegmentName } from '@/shared/model/segment-names';

import { fixed, moment, vector } from './format-values';

const LENGTH_LABELS: Record<string, string> = {
  head: 'Head', upperTrunk: 'Upper trunk', middleTrunk: 'Middle trunk', lowerTrunk: 'Lower trunk', upperArm: 'Upper arm',
  forearm: 'Forearm', hand: 'Hand', thigh: 'Thigh', shank: 'Shank', foot: 'Foot', ankleHeight: 'Ankle height',
};

const SEGMENT_COLUMNS: DataColumn<SegmentSummary>[] = [
  { header: 'Segment', cell: (s) => <Text variant="label">{SEGMENT_LABELS[s.name as SegmentName] ?? s.name}</Text>, minWidth: 135 },
  { header: 'Mass (kg)', cell: (s) => fixed(s.mass, 3), numeric: true, minWidth: 75 },
  { header: 'CoM x, y, z (m)', cell: (s) => vector(s.com), numeric: true, minWidth: 180 },
  { header: 'I1 (kg·m²)', cell: (s) => moment(s.principalMoments[0]), numeric: true, minWidth: 80 },
  { header: 'I2 (kg·m²)', cell: (s) => moment(s.principalMoments[1]), numeric: true, minWidth: 80 },
  { header: 'I3 (kg·m²)', cell: (s) => moment(s.principalMoments[2]), numeric: true, minWidth: 80 },
];

/** A figure of this overview: fixed width, a rule's room on its right. */
const Figure = (props: Omit<FigureProps, 'style'>) => <LabelledFigure {...props} style={styles.figure} />;

/** A profile version: whole-body figures in the reference posture, the inputs, and the derived segment table. */
export function ProfileOverview({ version }: { version: ProfileVersionView }) {
  const { summary: s, inputs: i } = version;
  const lengths = Object.entries(i.lengths ?? {});
  return (
    <View style={gaps.md}>
      <Card
        title={`Version ${version.version}${version.current ? ' (current)' : ''}`}
        subtitle={`${version.authorName ?? 'Seed'} · ${formatDateTime(version.createdAt)} · engine ${version.engineVersion}`}
        trailing={<Badge label={version.source === 'measured' ? 'Measured table' : 'Regression'} tone={version.source === 'measured' ? 'accent' : 'teal'} />}
      >
        {version.note ? <Text tone="muted">{version.note}</Text> : null}
      </Card>

      <Card title="Whole body" subtitle="Reference posture (standing, arms at the sides), root-segment frame: x forward, y left, z up">
        <View style={styles.figures} aria-label="Whole-body figures">
          <Figure label={i.suit || i.gear?.length ? `Mass incl. ${i.suit && i.gear?.length ? 'suit and gear' : i.suit ? 'suit' : 'gear'}` : 'Mass'} value={fixed(s.mass, 1)} unit="kg" />
          <Figure label="Centre of mass" value={vector(s.com)} unit="m" />
          <Figure label="Principal moments I1, I2, I3" value={s.principalMoments.map((m) => moment(m)).join(', ')} unit="kg·m²" />
        </View>
        <Text variant="caption" tone="muted">
          Figures from a regression model carry uncertainty; check a sequence&apos;s dispersion result before relying on it.
        </Text>
      </Card>

      <Card title="Inputs">
        <View style={styles.figures}>
          {i.sex ? <Figure label="Regression table" value={i.sex} unit="" /> : null}
          {i.stature !== undefined ? <Figure label="Stature" value={fixed(i.stature, 3)} unit="m" /> : null}
          {i.mass !== undefined ? <Figure label="Body mass" value={fixed(i.mass, 1)} unit="kg" /> : null}
          <Figure label="Biacromial breadth" value={i.biacromialBreadth !== undefined ? fixed(i.biacromialBreadth, 3) : 'default'} unit={i.biacromialBreadth !== undefined ? 'm' : ''} />
          <Figure label="Hip joint spacing" value={i.hipBreadth !== undefined ? fixed(i.hipBreadth, 3) : 'default'} unit={i.hipBreadth !== undefined ? 'm' : ''} />
          <Figure label="Suit" value={i.suit ? `${i.suit.name}${i.suit.illustrative ? ' (illustrative values)' : ''}` : 'none'} unit="" />
        </View>
        {lengths.length ? (
          <Text variant="caption" tone="muted">
            Measured lengths: {lengths.map(([k, v]) => `${LENGTH_LABELS[k] ?? k} ${fixed(v, 3)} m`).join(' · ')}
          </Text>
        ) : (
          <Text variant="caption" tone="muted">Segment lengths scaled from stature (no measured lengths).</Text>
        )}
        {i.gear?.length ? (
          <Text variant="caption" tone="muted">
            Gear: {i.gear.map((g) => `${g.name}, ${g.mass} kg on ${SEGMENT_LABELS[g.segment] ?? g.segment}`).join(' · ')}
          </Text>
        ) : null}
        {i.measuredTable ? (
          <Text variant="caption" tone="accent">
            Measured segment table {i.measuredTable.fileName} replaced: {i.measuredTable.segments.join(', ')}
          </Text>
        ) : null}
      </Card>

      <Card title="Segment table" subtitle="Each segment's mass, CoM in its own frame, and principal moments about its CoM" padding="none">
        <DataTable label="Derived segment table" columns={SEGMENT_COLUMNS} rows={s.segments} rowKey={(r) => r.name} />
        {version.source !== 'measured' ? (
          <Text variant="caption" tone="muted" style={styles.tableNote}>
            Masses: de Leva (1996) Table 4 fractions at their published four places. Those fractions sum to 0.9999 for women
            (1.0000 for men), so each segment gets its fraction divided by that sum: the rounding residue is spread over the
            segments in proportion and the segments add up to exactly the entered body mass{i.suit || i.gear?.length ? ' (plus suit and gear)' : ''}.
          </Text>
        ) : null}
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  tableNote: { padding: spacing.md },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg, marginBottom: spacing.sm },
  figure: { gap: 2, minWidth: 140, paddingRight: spacing.md, borderRightWidth: 0, borderColor: colors.border },
});
