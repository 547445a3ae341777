import { useEffect, useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { ApiError } from '@/components/api/client';
import { useSaveVersionMutation } from '@/components/api/use-sequences';
import { useIsWide } from '@/components/layout/use-is-wide';
import { RecordedSweepPicker } from '@/components/recordings/RecordedSweepPicker';
import { VersionRehearsals } from '@/components/rehearse/VersionRehearsals';
import { ReviewHistory } from '@/components/reviews/ReviewHistory';
import { colors, gaps, layout, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { EmptyState } from '@/components/ui/EmptyState';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { Text } from '@/components/ui/Text';
import { TextField } from '@/components/ui/TextField';
import type { SequenceDetail, VersionDetail } from '@/shared/contracts/maneuver';
import type { Plan, PlanCandidate } from '@/shared/contracts/plan';
import { defaultPrimitive, type Primitive } from '@/shared/primitives/primitive-schemas';

import { CompiledSteps } from './composer/CompiledSteps';
import { StepEditor } from './composer/StepEditor';
import { StepEditorSheet } from './composer/StepEditorSheet';
import { StepList } from './composer/StepList';
import { useComposerDraft } from './composer/use-composer-draft';
import { ManeuverCautions } from './ManeuverCautions';
import { CandidateComparison } from './planner/CandidateComparison';
import { type ReplacedSteps, StepsReplacedNotice } from './planner/StepsReplacedNotice';
import { SuggestSteps } from './planner/SuggestSteps';
import { VerificationReport } from './report/VerificationReport';
import { SequenceLifecycle } from './SequenceLifecycle';
import { SubmitForReview } from './submit/SubmitForReview';
import { useVersionChecks } from './submit/use-version-checks';
import { targetText } from './target-text';
import { CompareVersions } from './versions/CompareVersions';
import { VersionList } from './versions/VersionList';
import { VersionStatusBadge } from './VersionStatusBadge';
import { VersionStatusNotice } from './VersionStatusNotice';

/** The phone's three panels. */
export type ComposerPanel = 'steps' | 'report' | 'versions';

/** Props of {@link Composer}. */
export interface ComposerProps {
  sequence: SequenceDetail;
  /** The version on screen (null: the sequence has none yet). */
  version: VersionDetail | null;
  /** Planner or admin: may edit, save and submit. */
  canCompose: boolean;
  initialPanel?: ComposerPanel;
  /** Show another version (and a phone panel). */
  onOpenVersion: (versionId: string, panel?: ComposerPanel) => void;
  onBack: () => void;
}

type Editing = { index: number; step: Primitive; isNew: boolean } | null;

/** How long the undo snackbar stays after "Use these steps", ms (the banner over the steps stays). */
const SNACKBAR_MS = 12_000;

/**
 * The planner's workspace for one sequence: steps (add, edit, reorder, remove), compiled joint
 * steps on request, save-and-verify, submit, the verification report and the version history.
 * Phone: one panel at a time with a sheet to edit a step. Wide: steps, editor and report side by side.
 */
export function Composer({ sequence, version, canCompose, initialPanel, onOpenVersion, onBack }: ComposerProps) {
  const wide = useIsWide();
  const draft = useComposerDraft(version?.primitives ?? []);
  // The newest version number when this draft started: the server answers 409 if someone saved since.
  // Right after a save the sequence's version list may still be the cached one from before it (its
  // refetch is in flight), while the version on screen is the one just saved: take the larger.
  const [baseVersion] = useState(() => Math.max(sequence.versions[0]?.version ?? 0, version?.version ?? 0));
  const [panel, setPanel] = useState<ComposerPanel>(initialPanel ?? (version?.report ? 'report' : 'steps'));
  const [editing, setEditing] = useState<Editing>(null);
  // Channels of the recording just picked that the body cannot take (shown while that new step is edited).
  const [droppedChannels, setDroppedChannels] = useState<string[]>([]);
  const [showCompiled, setShowCompiled] = useState(false);
  const [note, setNote] = useState('');
  const save = useSaveVersionMutation(sequence.id);
  // "Use these steps" keeps the steps it replaced for Undo (banner over the list, a snackbar for a while).
  const [replaced, setReplaced] = useState<ReplacedSteps<Primitive> | null>(null);
  const [snack, setSnack] = useState(false);
  // The suggestions' side-by-side view (a finished plan; a suggestion previewed in 3D or none).
  const [comparison, setComparison] = useState<{ plan: Plan; preview: number | null } | null>(null);
  useEffect(() => {
    if (!snack) return;
    const timer = setTimeout(() => setSnack(false), SNACKBAR_MS);
    return () => clearTimeout(timer);
  }, [snack, replaced]);
  const undoReplace = () => {
    if (replaced) draft.replaceAll(replaced.previous);
    setReplaced(null);
    setSnack(false);
  };
  const applySuggestion = (c: PlanCandidate) => {
    // A second use keeps the steps from before the first, so Undo always returns to the planner's own.
    setReplaced((r) => ({ rank: c.rank, count: c.primitives.length, previous: r ? r.previous : draft.steps }));
    draft.replaceAll(c.primitives);
    setEditing(null);
    setSnack(true);
  };
  const dismissReplace = () => {
    setReplaced(null);
    setSnack(false);
  };

  // An archived maneuver is read-only until restored (the server refuses changes too).
  const editable = canCompose && sequence.archivedAt === null;
  const isLatest = !version || version.id === sequence.versions[0]?.id;
  const stale = save.error instanceof ApiError && save.error.status === 409;

  // A version keeps its own target; a new one is composed for the sequence's current target.
  const shownTarget = version?.target ?? sequence.target;
  const retargeted = !!version && targetText(version.target) !== targetText(sequence.target);
  const doSave = () =>
    save.mutate(
      { primitives: draft.steps, baseVersion, note, target: sequence.target },
      {
        onSuccess: (v) => {
          dismissReplace();
          onOpenVersion(v.id, 'report');
        },
      },
    );
  const applyStep = (index: number, step: Primitive) => {
    draft.put(index, step);
    setEditing(null);
  };

  const header = (
    <View style={gaps.xs}>
      <Button label="All maneuvers" icon="chevron-left" variant="ghost" size="sm" onPress={onBack} />
      <View style={styles.titleRow}>
        <Text variant="title" role="heading" aria-level={1} style={styles.flex}>
          {sequence.name}
        </Text>
        {version ? <VersionStatusBadge status={version.status} /> : null}
      </View>
      <Text tone="muted">
        {sequence.crewMemberName} · target {targetText(shownTarget)} · rate limit {shownTarget.rateLimitDegS} °/s
        {shownTarget.timeBudgetS != null ? ` · budget ${shownTarget.timeBudgetS} s` : ''}
      </Text>
      {retargeted ? (
        <Text variant="caption" tone="muted" testID="next-target">
          A new version will be verified for target {targetText(sequence.target)}.
        </Text>
      ) : null}
      <SequenceLifecycle sequence={sequence} canCompose={canCompose} onDeleted={onBack} />
      {version ? (
        <Text variant="caption" tone="muted">
          Showing version {version.version} of {sequence.versionCount}
          {isLatest ? '' : ' (not the newest)'} · profile v{version.profileVersion}
          {draft.dirty ? ' · unsaved changes' : ''}
        </Text>
      ) : null}
    </View>
  );

  const actions = editable ? (
    <View style={styles.actions}>
      {stale ? (
        <ErrorBanner
          title="Someone saved a newer version"
          error={`${save.error?.message ?? ''} Your steps are still here: open the newest version to see what changed, then add your changes again.`}
          onRetry={() => sequence.versions[0] && onOpenVersion(sequence.versions[0].id, 'versions')}
        />
      ) : (
        <ErrorBanner title="Could not save" error={save.error} />
      )}
      {draft.dirty || !version ? <TextField label="What changed (optional)" value={note} onChangeText={setNote} placeholder="e.g. smaller circles to stay clear of the shoulder limit" /> : null}
      <View style={styles.buttonRow}>
        <Button
          label="Save and verify"
          icon="cpu"
          loading={save.isPending}
          disabled={draft.steps.length === 0 || (!draft.dirty && !!version && version.status !== 'recheck' && !retargeted)}
          onPress={doSave}
          testID="save-verify"
        />
        {version?.allowed.submit && !draft.dirty ? <SubmitButton version={version} /> : null}
      </View>
      {save.isPending ? <Text variant="caption" tone="muted">The engine is verifying the new version on the current profile…</Text> : null}
    </View>
  ) : null;

  const stepsPanel = (
    <View style={gaps.md}>
      <View style={styles.panelHead}>
        <Text variant="heading" role="heading" aria-level={2} style={styles.flex}>
          Steps
        </Text>
        {editable ? (
          <Button label="Add step" icon="plus" variant="secondary" size="sm" onPress={() => setEditing({ index: draft.steps.length, step: defaultPrimitive('arm_orbit'), isNew: true })} />
        ) : null}
      </View>
      {editable ? (
        <RecordedSweepPicker
          crewMemberId={sequence.crewMemberId}
          onPick={(step, dropped) => {
            setDroppedChannels(dropped);
            setEditing({ index: draft.steps.length, step, isNew: true });
          }}
        />
      ) : null}
      {editable && replaced ? (
        <StepsReplacedNotice kind="banner" rank={replaced.rank} count={replaced.count} previousCount={replaced.previous.length} onUndo={undoReplace} onDismiss={dismissReplace} testID="steps-replaced" />
      ) : null}
      <StepList
        steps={draft.steps}
        selected={wide ? editing?.index : null}
        readOnly={!editable}
        onEdit={(i) => setEditing({ index: i, step: draft.steps[i], isNew: false })}
        onMove={draft.move}
        onRemove={(i) => {
          draft.remove(i);
          setEditing(null);
        }}
      />
      {editable ? (
        <SuggestSteps
          sequenceId={sequence.id}
          target={sequence.target}
          onUse={applySuggestion}
          onCompare={(plan, preview) => setComparison({ plan, preview })}
        />
      ) : null}
      <Button
        label={showCompiled ? 'Hide compiled steps' : 'Show compiled steps'}
        icon="code"
        variant="ghost"
        size="sm"
        onPress={() => setShowCompiled((s) => !s)}
        testID="toggle-compiled"
      />
      {showCompiled ? <CompiledSteps primitives={draft.steps} crewMemberId={sequence.crewMemberId} /> : null}
      {actions}
    </View>
  );

  const reportPanel = (
    <View style={gaps.md}>
      {version ? <VersionStatusNotice version={version} /> : null}
      {version?.report ? (
        <VerificationReport report={version.report} cues={version.cues} versionId={version.id} profileVersion={version.profileVersion} />
      ) : (
        <EmptyState icon="cpu" title="No verification report yet" body={editable ? 'Add steps, then Save and verify: the engine computes the report on the crew member’s current profile.' : 'This version has no report.'} />
      )}
      {version ? (
        <View style={gaps.md}>
          <Text variant="heading" role="heading" aria-level={2}>
            Review
          </Text>
          <ReviewHistory reviews={version.reviews} />
        </View>
      ) : null}
      {version && (version.status === 'cleared' || version.status === 'replaced' || version.status === 'recheck') ? <VersionRehearsals versionId={version.id} /> : null}
    </View>
  );

  const versionsPanel = (
    <View style={gaps.md}>
      <Text variant="heading" role="heading" aria-level={2}>
        Versions
      </Text>
      {sequence.versions.length ? (
        <>
          <VersionList versions={sequence.versions} selectedId={version?.id} onOpen={(id) => onOpenVersion(id, 'report')} />
          <CompareVersions versions={sequence.versions} />
        </>
      ) : (
        <Text tone="muted">No versions yet: Save and verify makes version 1.</Text>
      )}
    </View>
  );

  // Both layouts end with these, in the same place, so a resize keeps the comparison open.
  const overlays = (
    <>
      {editable && replaced && snack ? (
        <StepsReplacedNotice kind="snackbar" rank={replaced.rank} count={replaced.count} previousCount={replaced.previous.length} onUndo={undoReplace} onDismiss={() => setSnack(false)} testID="steps-replaced-snackbar" />
      ) : null}
      {editable && comparison ? (
        <CandidateComparison
          key={comparison.plan.id}
          visible
          onClose={() => setComparison(null)}
          sequenceId={sequence.id}
          plan={comparison.plan}
          target={sequence.target}
          initialPreview={comparison.preview}
          onUse={(c) => {
            setComparison(null);
            applySuggestion(c);
          }}
        />
      ) : null}
    </>
  );

  if (wide) {
    return (
      <View style={styles.root}>
      <ScrollView style={styles.root} contentContainerStyle={styles.wideContent}>
        {header}
        <View style={styles.columns}>
          <View style={styles.colSteps}>{stepsPanel}</View>
          <View style={styles.colEditor}>
            {editing ? (
              <Card title={editing.isNew ? `New step ${editing.index + 1}` : `Edit step ${editing.index + 1}`}>
                <StepEditor
                  key={`${editing.index}-${editing.isNew}-${draft.steps.length}`}
                  initial={editing.step}
                  position={editing.index + 1}
                  inlineButtons
                  crewMemberId={sequence.crewMemberId}
                  droppedChannels={editing.isNew ? droppedChannels : undefined}
                  onApply={(s) => applyStep(editing.index, s)}
                  onCancel={() => setEditing(null)}
                />
              </Card>
            ) : (
              <Card title="Step editor">
                <Text tone="muted">{editable ? 'Choose a step to edit it, or add one.' : 'Read only.'}</Text>
              </Card>
            )}
            {versionsPanel}
          </View>
          <View style={styles.colReport}>{reportPanel}</View>
        </View>
      </ScrollView>
      {overlays}
      </View>
    );
  }

  return (
    <View style={styles.root}>
    <ScrollView style={styles.root} contentContainerStyle={styles.phoneContent}>
      {header}
      <SegmentedControl
        label="Show"
        hideLabel
        options={[
          { value: 'steps', label: `Steps (${draft.steps.length})` },
          { value: 'report', label: 'Report' },
          { value: 'versions', label: 'Versions' },
        ]}
        value={panel}
        onChange={setPanel}
      />
      {panel === 'steps' ? stepsPanel : panel === 'report' ? reportPanel : versionsPanel}
      {panel === 'steps' ? <ManeuverCautions compact /> : null}
      <StepEditorSheet editing={editing} onApply={applyStep} onClose={() => setEditing(null)} crewMemberId={sequence.crewMemberId} droppedChannels={droppedChannels} />
    </ScrollView>
    {overlays}
    </View>
  );
}

/** Submit with the version's checks (a hook per shown version). */
function SubmitButton({ version }: { version: VersionDetail }) {
  const checks = useVersionChecks(version);
  return <SubmitForReview version={version} checks={checks} />;
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.background },
  wideContent: { padding: spacing.lg, gap: spacing.lg, maxWidth: layout.maxContentWidth + 320, width: '100%', alignSelf: 'center' },
  phoneContent: { padding: spacing.lg, gap: spacing.lg },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, flexWrap: 'wrap' },
  flex: { flex: 1 },
  columns: { flexDirection: 'row', gap: spacing.lg, alignItems: 'flex-start' },
  colSteps: { flex: 1, minWidth: 300 },
  colEditor: { flex: 1, minWidth: 300, gap: spacing.lg },
  colReport: { flex: 1.5, minWidth: 380, padding: spacing.md, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surface },
  panelHead: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  actions: { gap: spacing.md, marginTop: spacing.sm },
  buttonRow: { flexDirection: 'row', gap: spacing.sm, flexWrap: 'wrap' },
});
