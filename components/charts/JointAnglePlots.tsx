import { StyleSheet, View } from 'react-native';

import { useIsWide } from '@/components/layout/use-is-wide';
import { spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';
import type { RangeViolation } from '@/shared/contracts/result';
import { DOF_LABELS, isDofName } from '@/shared/model/dof-names';

import { LinePlot } from './LinePlot';
import { plotColors } from './plot-colors';

/** A dof's allowed range, degrees. */
export interface DofLimits {
  min: number;
  max: number;
}

/** Props of {@link JointAnglePlots}. */
export interface JointAnglePlotsProps {
  /** Sample times, seconds. */
  t: readonly number[];
  /** Angle series per dof name, degrees, one value per entry of `t`. */
  jointsDeg: Record<string, readonly number[]>;
  /** Allowed range per dof name, degrees (the profile's suited ranges); a band is drawn where known. */
  ranges?: Record<string, DofLimits>;
  /** Range violations, drawn as red bars under the line of their dof. */
  violations?: readonly RangeViolation[];
}

/** Dofs whose angle changes by less than this (degrees) are left out: a flat line says nothing. */
const MOVING_THRESHOLD_DEG = 0.5;

/** Human label of a dof (standard model names get their anatomical label). */
export function dofLabel(dof: string): string {
  return isDofName(dof) ? DOF_LABELS[dof] : dof;
}

/**
 * Small multiples: one plot per moving joint, its angle against time over its allowed range band,
 * with out-of-range stretches marked. One plot per dof keeps each band readable.
 */
export function JointAnglePlots({ t, jointsDeg, ranges, violations }: JointAnglePlotsProps) {
  const wide = useIsWide();
  const moving = Object.entries(jointsDeg).filter(([, v]) => v.length > 0 && Math.max(...v) - Math.min(...v) >= MOVING_THRESHOLD_DEG);
  if (moving.length === 0) {
    return <Text tone="muted">No joint moves in this sequence.</Text>;
  }
  return (
    <View style={[styles.grid, wide && styles.gridWide]} testID="joint-plots">
      {moving.map(([dof, values]) => {
        const lim = ranges?.[dof];
        const spans = (violations ?? []).filter((v) => v.dof === dof).map((v) => ({ from: v.from, to: v.to }));
        const lo = Math.min(...values);
        const hi = Math.max(...values);
        const summary =
          `Moves between ${lo.toFixed(0)}° and ${hi.toFixed(0)}°` +
          (lim ? `; allowed ${lim.min}° to ${lim.max}°` : '') +
          (spans.length ? `; out of range ${spans.length} time${spans.length > 1 ? 's' : ''}.` : '.');
        return (
          <View key={dof} style={[styles.cell, wide && styles.cellWide]}>
            <LinePlot
              title={dofLabel(dof)}
              summary={summary}
              x={t}
              series={[{ name: dofLabel(dof), color: spans.length ? plotColors.violation : plotColors.joint, values }]}
              band={lim ? { lo: lim.min, hi: lim.max } : undefined}
              spans={spans}
              yUnit="°"
              height={130}
              hideLegend
            />
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { gap: spacing.lg },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap' },
  cell: { alignSelf: 'stretch' },
  cellWide: { flexBasis: '47%', flexGrow: 1, minWidth: 260 },
});
