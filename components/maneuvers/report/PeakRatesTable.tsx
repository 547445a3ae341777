import { dofLabel } from '@/components/charts/JointAnglePlots';
import type { SimulationResult } from '@/shared/contracts/result';
import { SimpleTable } from '../SimpleTable';
import { fmtRate } from './format';

/** Props of {@link PeakRatesTable}. */
export interface PeakRatesTableProps {
  peak: SimulationResult['peakJointRateDegS'];
  /** Rate limit, deg/s; rows above it are highlighted. */
  limitDegS?: number | null;
  /** Per-dof limits, deg/s, when the profile has them (they win over `limitDegS`). */
  limitsByDof?: Record<string, number>;
}

/** Peak |joint rate| of every moving joint against its rate limit, fastest first. */
export function PeakRatesTable({ peak, limitDegS, limitsByDof }: PeakRatesTableProps) {
  const rows = Object.entries(peak.byDof)
    .filter(([, r]) => r > 0.05)
    .sort((a, b) => b[1] - a[1])
    .map(([dof, rate]) => ({ dof, rate, limit: limitsByDof?.[dof] ?? limitDegS ?? null }));
  return (
    <SimpleTable
      label="Peak joint rates"
      testID="peak-rates"
      rows={rows}
      rowKey={(r) => r.dof}
      rowTone={(r) => (r.limit != null && r.rate > r.limit ? 'danger' : undefined)}
      columns={[
        { header: 'Joint', cell: (r) => dofLabel(r.dof), minWidth: 150, flex: 2 },
        { header: 'Peak', cell: (r) => fmtRate(r.rate), numeric: true },
        { header: 'Limit', cell: (r) => (r.limit == null ? '—' : fmtRate(r.limit)), numeric: true },
        { header: 'Use', cell: (r) => (r.limit ? `${Math.round((100 * r.rate) / r.limit)}%` : '—'), numeric: true, minWidth: 60 },
      ]}
    />
  );
}
