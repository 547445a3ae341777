import { View } from 'react-native';

import { useCaptureTrendQuery } from '@/components/api/use-rehearsal-captures';
import { LinePlot, type LinePlotProps } from '@/components/charts/LinePlot';
import { plotColors } from '@/components/charts/plot-colors';
import { formatDateTime } from '@/components/format/date-time';
import { gaps } from '@/components/theme';
import { Card } from '@/components/ui/Card';
import { DataTable } from '@/components/ui/DataTable';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';
import type { CaptureTrendPoint } from '@/shared/contracts/recording';

const num = (v: number | null, digits: number) => (v === null || !Number.isFinite(v) ? '—' : v.toFixed(digits));

/** A small plot of one figure per recorded rehearsal, numbered 1, 2, … in the order they were performed. */
function TrendPlot(plot: Omit<LinePlotProps, 'x' | 'xUnit' | 'height'>) {
  return <LinePlot {...plot} x={plot.series[0].values.map((_, i) => i + 1)} xUnit="#" height={120} />;
}

/**
 * The trainee's recorded figures across rehearsals, oldest first: error to the target (on the plan's
 * profile), mean phase lag, and mean period and amplitude ratios of the sweep steps — as plots once
 * there are two recordings, and as a table with the reviewer's sign-off.
 */
export function CaptureTrend() {
  const q = useCaptureTrendQuery();
  if (q.isPending) return <LoadingState label="Loading your recorded rehearsals…" />;
  if (q.isError) return <ErrorBanner title="Could not load your recorded rehearsals" error={q.error} onRetry={() => void q.refetch()} />;
  const points: CaptureTrendPoint[] = [...q.data].reverse();
  const series = (pick: (p: CaptureTrendPoint) => number | null) => points.map((p) => pick(p) ?? NaN);
  return (
    <Card title="Your recorded rehearsals" subtitle={points.length ? `${points.length} with a recording` : undefined}>
      <View style={gaps.sm} testID="capture-trend">
        {points.length === 0 ? (
          <Text tone="muted">Attach a recording to a logged rehearsal (Recording, under each one in the history) to follow your timing and amplitude here.</Text>
        ) : null}
        {points.length >= 2 ? (
          <>
            <TrendPlot
              title="Mean phase lag per recorded rehearsal"
              summary={`From ${num(points[0].meanPhaseLagS, 2)} s to ${num(points.at(-1)!.meanPhaseLagS, 2)} s (positive: late).`}
              yUnit=" s"
              hideLegend
              series={[{ name: 'Phase lag', color: plotColors.yaw, values: series((p) => p.meanPhaseLagS) }]}
              testID="trend-lag"
            />
            <TrendPlot
              title="Mean amplitude and period ratio per recorded rehearsal"
              summary={`Amplitude ×${num(points.at(-1)!.meanAmplitudeRatio, 2)}, period ×${num(points.at(-1)!.meanPeriodRatio, 2)} in the latest (1 is as planned).`}
              yUnit="×"
              series={[
                { name: 'Amplitude', color: plotColors.pitch, values: series((p) => p.meanAmplitudeRatio) },
                { name: 'Period', color: plotColors.roll, values: series((p) => p.meanPeriodRatio) },
              ]}
              testID="trend-ratios"
            />
            <TrendPlot
              title="Error to the target per recorded rehearsal"
              summary={`From ${num(points[0].errorToTargetDeg, 1)}° to ${num(points.at(-1)!.errorToTargetDeg, 1)}°.`}
              yUnit="°"
              hideLegend
              series={[{ name: 'Error to target', color: plotColors.joint, values: series((p) => p.errorToTargetDeg) }]}
              testID="trend-error"
            />
          </>
        ) : null}
        {points.length ? (
          <DataTable
            label="Recorded figures per rehearsal"
            rows={points}
            rowKey={(p) => p.rehearsalId}
            columns={[
              { header: '#', cell: (p) => String(points.indexOf(p) + 1), numeric: true, minWidth: 32, flex: 0 },
              { header: 'When', cell: (p) => `${formatDateTime(p.performedAt)} · ${p.sequenceName} v${p.version}`, minWidth: 200, flex: 3 },
              { header: 'Error to target', cell: (p) => `${num(p.errorToTargetDeg, 1)}°`, numeric: true, minWidth: 90 },
              { header: 'Lag', cell: (p) => `${num(p.meanPhaseLagS, 2)} s`, numeric: true, minWidth: 70 },
              { header: 'Period', cell: (p) => `×${num(p.meanPeriodRatio, 2)}`, numeric: true, minWidth: 70 },
              { header: 'Amplitude', cell: (p) => `×${num(p.meanAmplitudeRatio, 2)}`, numeric: true, minWidth: 80 },
              { header: 'Signed off', cell: (p) => (p.signedOff ? 'yes' : 'not yet'), minWidth: 80 },
            ]}
          />
        ) : null}
      </View>
    </Card>
  );
}
