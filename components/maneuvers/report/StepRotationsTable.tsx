import { DataTable } from '@/components/ui/DataTable';
import type { StepRotation } from '@/shared/contracts/maneuver';

import { fmtDeg, fmtNum } from './format';

/** Props of {@link StepRotationsTable}. */
export interface StepRotationsTableProps {
  steps: readonly StepRotation[];
  /** The composer's cue of each step (by step index), for the first column. */
  cues: readonly string[];
}

const ypr = (r: { yaw: number; pitch: number; roll: number }) => `${fmtNum(r.yaw, 1)} / ${fmtNum(r.pitch, 1)} / ${fmtNum(r.roll, 1)}`;

/**
 * Where the rotation comes from: each composer step's rotation (about the body's axes at the
 * step's start) as an angle and as yaw/pitch/roll, its share of the path travelled, and the
 * rotation of one cycle of each sweep in it.
 */
export function StepRotationsTable({ steps, cues }: StepRotationsTableProps) {
  return (
    <DataTable
      label="Rotation of each step"
      testID="step-rotations"
      rows={steps}
      rowKey={(r) => String(r.step)}
      columns={[
        { header: 'Step', cell: (r) => `${r.step + 1}. ${cues[r.step] ?? ''}`, minWidth: 170, flex: 3 },
        { header: 'Time (s)', cell: (r) => `${fmtNum(r.startS, 1)}–${fmtNum(r.endS, 1)}`, numeric: true, minWidth: 90 },
        { header: 'Rotation', cell: (r) => fmtDeg(r.rotation.angleDeg, 2), numeric: true, minWidth: 80 },
        { header: 'Yaw / pitch / roll (°)', cell: (r) => ypr(r.rotation.yprDeg), numeric: true, minWidth: 150 },
        { header: 'Path', cell: (r) => fmtDeg(r.pathDeg, 0), numeric: true, minWidth: 70 },
        {
          header: 'Per cycle',
          cell: (r) => (r.sweeps.length
            ? r.sweeps.map((s) => `${s.cycles} × ${fmtDeg(s.perCycle.angleDeg, 2)} (${ypr(s.perCycle.yprDeg)})`).join('; ')
            : '—'),
          minWidth: 200, flex: 2,
        },
      ]}
    />
  );
}
