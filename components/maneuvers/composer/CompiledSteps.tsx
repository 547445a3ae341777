import { View } from 'react-native';

import { useCompileQuery } from '@/components/api/use-sequences';
import { dofLabel } from '@/components/charts/JointAnglePlots';
import { gaps } from '@/components/theme';
import { DataTable } from '@/components/ui/DataTable';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';
import type { Step } from '@/shared/contracts/sequence';
import type { Primitive } from '@/shared/primitives/primitive-schemas';

import { fmtSeconds } from '../report/format';

/** Props of {@link CompiledSteps}. */
export interface CompiledStepsProps {
  primitives: readonly Primitive[];
  /** Whose current profile gives the joint ranges for warnings. */
  crewMemberId?: string;
}

/** Short text of what one engine step does to which joints. */
function stepText(step: Step): string {
  if (step.kind === 'hold') return 'nothing moves';
  if (step.kind === 'move') {
    const parts = Object.entries(step.to).map(([d, v]) => `${dofLabel(d)} → ${v.toFixed(0)}°`);
    return parts.length ? parts.join(', ') : 'no change';
  }
  if (step.kind === 'track') {
    return `recorded ${step.dofs.map(dofLabel).join(', ')} — ${step.frames.length} frames at ${step.rateHz} Hz`;
  }
  return Object.entries(step.joints)
    .map(([d, j]) => `${dofLabel(d)} ${j.offset.toFixed(0)}° ± ${Math.abs(j.amplitude).toFixed(0)}°`)
    .join(', ') + ` — ${step.cycles} × ${step.period} s`;
}

/** The joint-space steps (move / harmonic / hold / track) the composed primitives compile to, with blends marked. */
export function CompiledSteps({ primitives, crewMemberId }: CompiledStepsProps) {
  const q = useCompileQuery(primitives.length ? { primitives: [...primitives], crewMemberId } : null);
  if (primitives.length === 0) return <Text tone="muted">Add a step to see its joint steps.</Text>;
  if (q.isPending) return <LoadingState label="Compiling the steps…" />;
  if (q.isError) return <ErrorBanner title="Could not compile the steps" error={q.error} onRetry={() => void q.refetch()} />;
  const c = q.data;
  const rows = c.compiled.steps.map((s, i) => ({ step: s as Step, origin: c.stepMap[i] }));
  return (
    <View style={gaps.sm} testID="compiled-steps">
      <Text variant="caption" tone="muted">
        {rows.length} joint steps, {fmtSeconds(c.durationS, 1)} in all. Blends are inserted where a step would not start where the previous one ended.
      </Text>
      {c.errors.map((e) => (
        <Text key={e.field + e.message} tone="danger" role="alert">
          Step {e.primitive + 1}: {e.message}
        </Text>
      ))}
      {c.warnings.map((w) => (
        <Text key={w.field + w.message} tone="accent" variant="caption">
          Step {w.primitive + 1}: {w.message}
        </Text>
      ))}
      <DataTable
        label="Compiled joint steps"
        rows={rows}
        rowKey={(_, i) => String(i)}
        columns={[
          { header: '#', cell: (_r) => String(rows.indexOf(_r) + 1), numeric: true, minWidth: 36, flex: 0 },
          { header: 'Kind', cell: (r) => (r.origin?.role === 'blend' ? 'blend (move)' : r.step.kind), minWidth: 90 },
          { header: 'From step', cell: (r) => (r.origin ? String(r.origin.primitive + 1) : '—'), numeric: true, minWidth: 70 },
          { header: 'Time', cell: (r) => (r.origin ? `${r.origin.startS.toFixed(1)}–${r.origin.endS.toFixed(1)} s` : '—'), numeric: true, minWidth: 100 },
          { header: 'Joints', cell: (r) => <Text variant="caption">{stepText(r.step)}</Text>, minWidth: 260, flex: 4 },
        ]}
      />
    </View>
  );
}
