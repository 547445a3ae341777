import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { useAttachRecordingMutation, useRehearsalCaptureQuery, useSignOffCaptureMutation } from '@/components/api/use-rehearsal-captures';
import { dofLabel } from '@/components/charts/JointAnglePlots';
import { LinePlot } from '@/components/charts/LinePlot';
import { plotColors } from '@/components/charts/plot-colors';
import { FilePicker } from '@/components/crew/FilePicker';
import { UploadProblems } from '@/components/recordings/UploadProblems';
import { colors, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import { Text } from '@/components/ui/Text';
import type { RehearsalCapture } from '@/shared/contracts/recording';

/** Props of {@link RehearsalCapturePanel}. */
export interface RehearsalCapturePanelProps {
  rehearsalId: string;
  /** Whether the viewer may sign the recording off (reviewers, admins); default false. */
  canSignOff?: boolean;
}

const f1 = (v: number) => (Number.isFinite(v) ? v.toFixed(1) : '—');
const f2 = (v: number) => (Number.isFinite(v) ? v.toFixed(2) : '—');
const ypr = (a: { yaw: number; pitch: number; roll: number }) => `yaw ${f1(a.yaw)}°, pitch ${f1(a.pitch)}°, roll ${f1(a.roll)}°`;

/**
 * A rehearsal's recording: attach a joint-angle CSV or BVH file, then read what that motion would
 * have done in free fall (reached attitude vs target and plan), per-step timing and amplitude, and
 * the overlay of planned and executed motion; reviewers sign it off.
 */
export function RehearsalCapturePanel({ rehearsalId, canSignOff = false }: RehearsalCapturePanelProps) {
  const [open, setOpen] = useState(false);
  const q = useRehearsalCaptureQuery(rehearsalId, open);
  const attach = useAttachRecordingMutation(rehearsalId);
  const signOff = useSignOffCaptureMutation(rehearsalId);
  const [file, setFile] = useState<File | null>(null);
  if (!open) return <Button label="Recording" icon="activity" variant="ghost" size="sm" onPress={() => setOpen(true)} testID={`capture-open-${rehearsalId}`} />;
  if (q.isPending) return <LoadingState label="Loading the recording…" />;
  if (q.isError) return <ErrorBanner title="Could not load the recording" error={q.error} onRetry={() => void q.refetch()} />;
  if (!q.data) {
    return (
      <View style={styles.wrap} testID="capture-attach">
        <FilePicker label="Attach a recording (joint-angle CSV or BVH)" accept=".csv,.bvh" onPick={setFile} hint="The server simulates your recorded motion on your body in free fall." />
        <Button label="Attach and simulate" icon="upload" size="sm" disabled={!file} loading={attach.isPending} onPress={() => file && attach.mutate(file)} />
        <UploadProblems error={attach.error} outcome={attach.data} maxRows={20} />
      </View>
    );
  }
  return <CaptureView capture={q.data} canSignOff={canSignOff} onSignOff={(note) => signOff.mutate(note)} signing={signOff.isPending} />;
}

/** The figures and plots of one capture. */
function CaptureView({ capture: c, canSignOff, onSignOff, signing }: { capture: RehearsalCapture; canSignOff: boolean; onSignOff: (note: string) => void; signing: boolean }) {
  const dofs = Object.keys(c.overlay.planned);
  return (
    <View style={styles.wrap} testID="capture-view">
      <Text variant="label">What this motion would have done in free fall</Text>
      {c.outcomes.map((o) => (
        <View key={o.profileVersionId} testID={`capture-outcome-${o.role}`}>
          <Text variant="caption">
            {o.role === 'plan' ? `On the profile the plan was verified for (v${o.profileVersion})` : `On your current profile (v${o.profileVersion})`}: {ypr(o.reachedYprDeg)}
          </Text>
          <Text variant="caption" tone="muted">
            {f1(o.errorToTargetDeg)}° from the target{c.targetYprDeg ? ` (${ypr(c.targetYprDeg)})` : ''}, {f1(o.errorToPlanDeg)}° from the plan&apos;s own result
          </Text>
        </View>
      ))}
      <Text variant="label">Timing per sweep</Text>
      {c.steps.length === 0 ? <Text tone="muted">No sweep step of the plan was covered by the recording.</Text> : null}
      {c.steps.map((s) => (
        <Text key={s.step} variant="caption" testID={`capture-step-${s.step}`}>
          {`Step ${s.step}, ${s.cue}: ${s.phaseLagS >= 0 ? 'late' : 'early'} ${f2(Math.abs(s.phaseLagS))} s · period ×${f2(s.periodRatio)} · amplitude ×${f2(s.amplitudeRatio)}`}
        </Text>
      ))}
      <LinePlot
        title="Turn from the start, planned and executed"
        summary={`Planned turn ends at ${f1(c.overlay.plannedTurnDeg.at(-1) ?? NaN)}°, executed at ${f1(c.overlay.executedTurnDeg.at(-1) ?? NaN)}°.`}
        x={c.overlay.t}
        yUnit="°"
        height={160}
        series={[
          { name: 'Planned', color: plotColors.yaw, values: c.overlay.plannedTurnDeg, dashed: true },
          { name: 'Executed', color: plotColors.pitch, values: c.overlay.executedTurnDeg },
        ]}
        testID="capture-overlay-turn"
      />
      {dofs.slice(0, 4).map((d) => (
        <LinePlot
          key={d}
          title={`${dofLabel(d)}, planned and executed`}
          summary={`${dofLabel(d)} over time, planned (dashed) and recorded.`}
          x={c.overlay.t}
          yUnit="°"
          height={120}
          series={[
            { name: 'Planned', color: plotColors.yaw, values: c.overlay.planned[d], dashed: true },
            { name: 'Executed', color: plotColors.pitch, values: c.overlay.executed[d] },
          ]}
        />
      ))}
      <Text variant="caption" tone="muted">{c.assumptions.join(' ')}</Text>
      <Text variant="caption" tone="muted">A planning and training aid: follow the program&apos;s flight rules and certified procedures.</Text>
      {c.signedOff ? (
        <Text variant="caption" tone="accent" testID="capture-signed-off">Signed off by {c.signedOff.byName}{c.signedOff.note ? `: ${c.signedOff.note}` : ''}</Text>
      ) : canSignOff ? (
        <Button label="Sign off" icon="check" size="sm" loading={signing} onPress={() => onSignOff('')} />
      ) : (
        <Text variant="caption" tone="muted">Not signed off yet.</Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs, paddingTop: spacing.xs, borderTopWidth: 1, borderTopColor: colors.border },
});
