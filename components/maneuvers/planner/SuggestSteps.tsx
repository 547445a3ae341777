import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { planEnded, useCancelPlanMutation, useLatestPlanQuery, usePlanQuery, useStartPlanMutation } from '@/components/api/use-plans';
import { PlannerNotes } from '@/components/maneuvers/planner/PlannerNotes';
import { colors, radii, spacing } from '@/components/theme';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { Figure } from '@/components/ui/Figure';
import { Icon } from '@/components/ui/Icon';
import { Text } from '@/components/ui/Text';
import type { SequenceTarget } from '@/shared/contracts/maneuver';
import type { Plan, PlanCandidate } from '@/shared/contracts/plan';
import type { DispersionSpreads } from '@/shared/contracts/robustness';
import { meetsLimits } from '@/shared/product/candidate-limits';


/** Props of {@link SuggestSteps}. */
export interface SuggestStepsProps {
  sequenceId: string;
  /** The sequence's target (tolerance colours the errors; the comparison draws it). */
  target: SequenceTarget;
  /** Replaces the composer's steps with a suggestion's (left unsaved; the composer offers Undo). */
  onUse: (candidate: PlanCandidate) => void;
  /**
   * Opens the side-by-side view of a finished plan, with a suggestion previewed in 3D (rank) or none.
   * The composer shows it (CandidateComparison), outside its phone/wide layouts, so it stays open when the window is resized.
   */
  onCompare: (plan: Plan, previewRank: number | null) => void;
}

/** Robustness levels in words (feedback 95th percentile against the tolerance). */
const ROBUSTNESS_WORDS: Record<PlanCandidate['robustness']['level'], string> = { robust: 'Robust', marginal: 'Marginal', not_robust: 'Not robust' };

const deg = (x: number) => `${x < 0.1 ? x.toFixed(2) : x.toFixed(1)}°`;

// Plans stored before the pairing existed have no pairedLimbs: nothing is said about it.
const PAIRING_WORDS: Record<string, string> = { together: ' (both limbs of a pair in step)', independent: ' (each limb on its own)' };

/** The spreads of a dispersion run as one line. */
export function spreadsText(s: DispersionSpreads): string {
  return `segment mass ±${s.massPct} %, length ±${s.lengthPct} %, amplitude ±${s.amplitudePct} %, period ±${s.periodPct} %, joint timing ±${s.phaseDeg}°${PAIRING_WORDS[String(s.pairedLimbs)] ?? ''}`;
}

/**
 * "Suggest steps": starts a planning run on the server, shows its progress, then the ranked
 * candidates (cues, duration, error to target, 95th-percentile errors open-loop and with feedback, robustness level, rotation travelled, peak rate) with
 * "Use these steps", which replaces the composer's step list without saving (the composer offers Undo),
 * "Preview in 3D" and "Compare side by side" (CandidateComparison: table, overlaid attitude, 3D). On opening it shows
 * the sequence's latest plan (still running or finished), so a reload loses nothing.
 */
export function SuggestSteps({ sequenceId, target, onUse, onCompare }: SuggestStepsProps) {
  const toleranceDeg = target.toleranceDeg;
  // The plan started here; until then, the sequence's latest one from the server.
  const [startedPlanId, setStartedPlanId] = useState<string | null>(null);
  const latest = useLatestPlanQuery(sequenceId, startedPlanId === null);
  const planId = startedPlanId ?? latest.data?.id ?? null;
  const start = useStartPlanMutation(sequenceId);
  const plan = usePlanQuery(sequenceId, planId);
  const state = plan.data?.state;
  const cancel = useCancelPlanMutation(sequenceId);
  const busy = start.isPending || (!!planId && !planEnded(state));

  return (
    <View style={styles.root} testID="suggest-steps">
      <View style={styles.row}>
        <Button
          label={planId && !busy ? 'Suggest again' : 'Suggest steps'}
          icon="zap"
          variant="secondary"
          size="sm"
          loading={busy}
          onPress={() => start.mutate({}, { onSuccess: (r) => setStartedPlanId(r.planId) })}
          testID="suggest-steps-button"
        />
        {busy ? (
          <Text variant="caption" tone="muted" style={styles.flex}>
            {plan.data ? `${Math.round(plan.data.progress * 100)} % · ${plan.data.progressNote || plan.data.state}` : 'Queuing the planner…'}
          </Text>
        ) : null}
        {busy && planId ? (
          <Button label="Stop" icon="x" variant="ghost" size="sm" loading={cancel.isPending} onPress={() => cancel.mutate(planId)} testID="cancel-plan" />
        ) : null}
      </View>
      <ErrorBanner title="Could not start the planner" error={start.error} />
      <ErrorBanner title="Could not stop the planner" error={cancel.error} />
      <ErrorBanner title="Could not look up earlier suggestions" error={startedPlanId === null ? latest.error : null} />
      <ErrorBanner title="Could not read the plan" error={plan.error} />
      {state === 'failed' && plan.data?.notes.length ? <PlannerNotes kind="unreachable" notes={plan.data.notes} /> : null}
      {state === 'failed' && !plan.data?.notes.length ? <ErrorBanner title="The planner failed" error={plan.data?.error ?? 'unknown error'} /> : null}
      {state === 'cancelled' ? (
        <Text tone="muted" role="status" testID="plan-cancelled">
          Planning stopped. {plan.data?.error ?? ''} Nothing was suggested; start it again when you are ready.
        </Text>
      ) : null}
      {state === 'done' && plan.data ? (
        <View style={styles.list} role="list" aria-label="Suggested step lists">
          <Text variant="caption" tone="muted">
            {plan.data.candidates.length} suggestion{plan.data.candidates.length === 1 ? '' : 's'} in {plan.data.elapsedS?.toFixed(1)} s, best first
            {startedPlanId === null ? ` (requested ${new Date(plan.data.createdAt).toLocaleString()})` : ''}.
          </Text>
          <PlannerNotes kind="remarks" notes={plan.data.notes} />
          {plan.data.candidates.length ? (
            <Button label="Compare side by side" icon="columns" variant="secondary" size="sm" onPress={() => onCompare(plan.data, null)} testID="compare-suggestions" />
          ) : null}
          {plan.data.candidates.map((c) => (
            <CandidateCard key={c.rank} candidate={c} toleranceDeg={toleranceDeg} onUse={() => onUse(c)} onPreview={() => onCompare(plan.data, c.rank)} />
          ))}
          <View style={styles.note} role="note">
            <Icon name="alert-circle" size={16} color={colors.accent} />
            <Text variant="caption" style={styles.flex}>
              The robustness spreads are illustrative, not measured: {spreadsText(plan.data.settings.spreads)}. “With feedback” assumes the
              crew member stops or adds cycles from the attitude they see (perception error {plan.data.settings.perceptionErrorDeg ?? 2}° per axis, reaction delay{' '}
              {plan.data.settings.reactionDelayS ?? 0.3} s: assumptions). A planning and training aid: verify the steps on the crew member’s profile, judge the
              95th-percentile errors, and follow flight rules and certified procedures.
            </Text>
          </View>
        </View>
      ) : null}
    </View>
  );
}

function CandidateCard({ candidate: c, toleranceDeg, onUse, onPreview }: { candidate: PlanCandidate; toleranceDeg: number; onUse: () => void; onPreview: () => void }) {
  const ok = meetsLimits(c);
  return (
    <Card
      title={`Suggestion ${c.rank}`}
      subtitle={`${c.durationS.toFixed(1)} s · ${c.primitives.length} steps`}
      trailing={<Badge label={ok ? 'Within limits' : 'Misses a limit'} tone={ok ? 'success' : 'danger'} />}
    >
      <View style={styles.card} role="listitem" aria-label={`Suggestion ${c.rank}`} testID={`plan-candidate-${c.rank}`}>
        {c.cues.map((cue, i) => (
          <Text key={i} variant="caption">
            {i + 1}. {cue}
          </Text>
        ))}
        <View style={styles.figures}>
          <Verdict label="Error to target" value={deg(c.errorDeg)} bad={c.errorDeg > toleranceDeg} />
          {c.robustness ? (
            <>
              <Verdict label="95th pct, with feedback" value={deg(c.robustness.feedbackP95Deg)} bad={c.robustness.feedbackP95Deg > 3 * toleranceDeg} />
              <Verdict label="95th pct, open-loop" value={deg(c.robustness.openLoopP95Deg)} bad={c.robustness.openLoopP95Deg > 3 * toleranceDeg} />
              <Verdict label="Robustness" value={ROBUSTNESS_WORDS[c.robustness.level]} bad={c.robustness.level !== 'robust'} />
            </>
          ) : null}
          {typeof c.netPathDeg === 'number' ? <Verdict label="Turns through" value={deg(c.netPathDeg)} bad={c.detour} /> : null}
          <Verdict label="Peak rate" value={`${Math.round(c.peakJointRateDegS)} °/s`} bad={!c.withinRateLimit} />
          {c.rangeViolationCount ? <Verdict label="Range violations" value={String(c.rangeViolationCount)} bad /> : null}
        </View>
        <View style={styles.row}>
          <Button label="Use these steps" icon="check" size="sm" onPress={onUse} testID={`use-candidate-${c.rank}`} />
          <Button label="Preview in 3D" icon="box" variant="secondary" size="sm" onPress={onPreview} accessibilityLabel={`Preview suggestion ${c.rank} in 3D`} testID={`preview-candidate-${c.rank}`} />
        </View>
      </View>
    </Card>
  );
}

/** A judged figure of a suggestion: red when it misses what the maneuver asks. */
function Verdict({ label, value, bad }: { label: string; value: string; bad: boolean }) {
  return <Figure label={label} value={value} variant="bodyStrong" tone={bad ? 'danger' : 'default'} style={styles.figure} />;
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  flex: { flex: 1 },
  list: { gap: spacing.md },
  card: { gap: spacing.xs },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg, marginVertical: spacing.sm },
  figure: { minWidth: 96 },
  note: { flexDirection: 'row', gap: spacing.sm, padding: spacing.md, borderRadius: radii.md, backgroundColor: colors.accentTint },
});
