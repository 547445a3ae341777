import { dofLabel } from '@/components/charts/JointAnglePlots';
import { DataTable } from '@/components/ui/DataTable';
import { Text } from '@/components/ui/Text';
import type { RangeViolation } from '@/shared/contracts/result';

import { fmtDeg, fmtSeconds } from './format';

/** Props of {@link RangeViolationsTable}. */
export interface RangeViolationsTableProps {
  violations: readonly RangeViolation[];
}

/** Which joint leaves its range, in which step, when, and by how much (worst excursion). */
export function RangeViolationsTable({ violations }: RangeViolationsTableProps) {
  return (
    <DataTable
      label="Range violations"
      testID="range-violations"
      empty={
        <Text tone="success" testID="no-range-violations">
          Every joint stays within its allowed range.
        </Text>
      }
      rows={violations}
      rowKey={(v, i) => `${v.dof}-${v.step}-${i}`}
      rowTone={() => 'danger'}
      columns={[
        { header: 'Joint', cell: (v) => dofLabel(v.dof), minWidth: 150, flex: 2 },
        { header: 'Step', cell: (v) => String(v.step + 1), numeric: true, minWidth: 50 },
        { header: 'When', cell: (v) => `${fmtSeconds(v.from, 1)}–${fmtSeconds(v.to, 1)}`, numeric: true, minWidth: 110 },
        { header: 'Limit', cell: (v) => `${v.bound} ${fmtDeg(v.limitDeg, 0)}`, numeric: true },
        { header: 'Beyond by', cell: (v) => fmtDeg(v.marginDeg), numeric: true },
      ]}
    />
  );
}
