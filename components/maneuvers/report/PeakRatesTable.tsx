import { dofLabel } from '@/components/charts/JointAnglePlots';
import { DataTable } from '@/components/ui/DataTable';

import { fmtRate } from './format';

/** Props of {@link PeakRatesTable}. */
export interface PeakRatesTableProps {
  /** Peak |rate| per dof, deg/s. */
  byDof: Record<string, number>;
  /** Rate limit, deg/s; rows above it are highlighted. */
  limitDegS: number;
}

/** Peak |joint rate| of every moving joint against the rate limit, fastest first. */
export function PeakRatesTable({ byDof, limitDegS }: PeakRatesTableProps) {
  const rows = Object.entries(byDof)
    .filter(([, r]) => r > 0.05)
    .sort((a, b) => b[1] - a[1])
    .map(([dof, rate]) => ({ dof, rate }));
  return (
    <DataTable
      label="Peak joint rates"
      testID="peak-rates"
      rows={rows}
      rowKey={(r) => r.dof}
      rowTone={(r) => (r.rate > limitDegS ? 'danger' : undefined)}
      columns={[
        { header: 'Joint', cell: (r) => dofLabel(r.dof), minWidth: 150, flex: 2 },
        { header: 'Peak', cell: (r) => fmtRate(r.rate), numeric: true },
        { header: 'Of limit', cell: (r) => `${Math.round((100 * r.rate) / limitDegS)}%`, numeric: true, minWidth: 70 },
      ]}
    />
  );
}
