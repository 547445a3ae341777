import { useMemo, useState, useSyncExternalStore } from 'react';
import { StyleSheet, View } from 'react-native';

import { colors, radii, spacing } from '@/components/theme';
import { Button } from '@/components/ui/Button';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { SegmentedControl } from '@/components/ui/SegmentedControl';
import { Text } from '@/components/ui/Text';
import type { CameraMode, ViewPreset } from '@/scene/camera-presets';
import { PlaybackClock } from '@/scene/playback/playback-clock';
import RehearsalCanvas from '@/scene/RehearsalCanvas';
import { buildSceneModel } from '@/scene/scene-model';
import { scenePalette } from '@/scene/scene-palette';
import type { PlayerMotion } from '@/shared/contracts/motion';
import { PLAYBACK_SPEEDS } from '@/shared/contracts/playback-speeds';
import { engineBindingText } from '@/shared/product/engine-binding';

import { ControlButton } from './ControlButton';
import { CueCard } from './CueCard';
import { StepTimeline } from './StepTimeline';
import { useBeatTick } from './use-beat-tick';

/** What a run amounted to, for the log form. */
export interface RunSummary {
  /** Steps played through. */
  completedSteps: number;
  totalSteps: number;
  /** × real time at the end of the run. */
  playbackSpeed: number;
}

/** Props of {@link RehearsalPlayer}. */
export interface RehearsalPlayerProps {
  /** A saved version's motion, or a planner suggestion's (previewed before it is used). */
  motion: PlayerMotion;
  /** Shows a close button; called with the run so far. Default none (embedded preview). */
  onClose?: (run: RunSummary) => void;
  /** Shows "Log rehearsal"; called with the run so far. Default none. */
  onLog?: (run: RunSummary) => void;
  /** Embedded preview inside a report: smaller controls, no title bar. Default false. */
  compact?: boolean;
  /** The version's robustness caution, shown on the cue card (marginal or not robust); default none. */
  caution?: string | null;
}

const SPEED_OPTIONS = PLAYBACK_SPEEDS.map((s) => ({ value: String(s), label: `${s}×` }));
const CAMERA_OPTIONS = [
  { value: 'observer', label: 'Observer' },
  { value: 'body', label: 'Body-fixed' },
] as const;
const PRESETS: { value: ViewPreset; label: string }[] = [
  { value: 'front', label: 'Front' },
  { value: 'side', label: 'Side' },
  { value: 'above', label: 'Above' },
];

/**
 * The 3D rehearsal player: the body performing the version, the current cue with cycle count and
 * beat, a step timeline to scrub, transport (previous/next step, play/pause, loop a step, tick sound),
 * speed 0.25×–2×, observer or body-fixed camera with preset views.
 */
export default function RehearsalPlayer({ motion, onClose, onLog, compact = false, caution = null }: RehearsalPlayerProps) {
  const built = useMemo(() => {
    try {
      return { scene: buildSceneModel(motion), error: null };
    } catch (e) {
      return { scene: null, error: e as Error };
    }
  }, [motion]);
  const clock = useMemo(() => new PlaybackClock(motion.duration, motion.steps), [motion]);
  const snap = useSyncExternalStore(clock.subscribe, clock.getSnapshot, clock.getSnapshot);
  const [cameraMode, setCameraMode] = useState<CameraMode>('observer');
  const [preset, setPreset] = useState<ViewPreset>('front');
  const [presetNonce, setPresetNonce] = useState(0);
  const [sound, setSound] = useState(false);
  // Height of the cue overlay, so the 3D view centres the body below it.
  const [inset, setInset] = useState(0);
  useBeatTick(snap, sound);

  if (!built.scene) return <ErrorBanner title="This maneuver cannot be shown" error={built.error} />;
  const run = (): RunSummary => ({ completedSteps: snap.completedSteps, totalSteps: motion.steps.length, playbackSpeed: snap.speed });
  const step = motion.steps[snap.step];

  return (
    <View style={styles.root} testID="rehearsal-player">
      {!compact ? (
        <View style={styles.titleRow}>
          {onClose ? <ControlButton icon="x" label="Close player" onPress={() => onClose(run())} /> : null}
          <View style={styles.titleText}>
            <Text variant="label" numberOfLines={1}>
              {motion.sequenceName} · {'rank' in motion ? `suggestion ${motion.rank}` : `v${motion.version}`}
            </Text>
            <Text variant="caption" tone="muted" numberOfLines={1}>
              {motion.crewMemberName} · {motion.duration.toFixed(1)} s · {snap.speed}×
            </Text>
            <Text variant="caption" tone={motion.verifiedByOtherEngine ? 'accent' : 'muted'} numberOfLines={motion.verifiedByOtherEngine ? 3 : 1} testID="player-engine">
              {engineBindingText(motion.engineVersion, motion.runningEngineVersion)}
            </Text>
          </View>
          {onLog ? <Button label="Log run" icon="edit-3" size="sm" variant={snap.ended ? 'primary' : 'secondary'} onPress={() => onLog(run())} accessibilityLabel="Log rehearsal" /> : null}
        </View>
      ) : null}

      <View style={styles.stage}>
        <View style={StyleSheet.absoluteFill}>
          <RehearsalCanvas
            scene={built.scene}
            clock={clock}
            cameraMode={cameraMode}
            preset={preset}
            presetNonce={presetNonce}
            topInset={inset}
            label={`3D view of ${motion.sequenceName} on ${motion.crewMemberName}'s body`}
          />
        </View>
        <View style={styles.overlay} pointerEvents="box-none" onLayout={(e) => setInset(Math.round(e.nativeEvent.layout.height))}>
          <CueCard
            step={step}
            stepCount={motion.steps.length}
            cycle={snap.cycle}
            beats={snap.beats}
            nextCue={motion.steps[snap.step + 1]?.cue}
            inLeadIn={!!step?.leadIn && snap.time < step.leadIn.end - 1e-6}
            caution={caution}
          />
          <View style={styles.legend} pointerEvents="none">
            <LegendDot color={scenePalette.left} label="Left" />
            <LegendDot color={scenePalette.right} label="Right" />
            <LegendDot color={scenePalette.ghost} label="Target" />
            <LegendDot color={scenePalette.trail} label="Head path" />
          </View>
        </View>
      </View>

      <View style={styles.panel}>
        <View style={[styles.panelInner, compact && styles.panelCompact]}>
        <StepTimeline steps={motion.steps} duration={motion.duration} time={snap.time} current={snap.step} loopStep={snap.loopStep} onSeek={(t) => clock.seek(t)} />
        <View style={styles.transport}>
          <ControlButton icon="skip-back" label="Previous step" disabled={snap.step === 0 && snap.time - (step?.start ?? 0) <= 1} onPress={() => clock.prevStep()} />
          <ControlButton icon={snap.playing ? 'pause' : 'play'} label={snap.playing ? 'Pause' : 'Play'} primary onPress={() => clock.toggle()} />
          <ControlButton icon="skip-forward" label="Next step" disabled={snap.step >= motion.steps.length - 1} onPress={() => clock.nextStep()} />
          <ControlButton icon="repeat" label="Loop this step" active={snap.loopStep !== null} onPress={() => clock.toggleLoop()} />
          <ControlButton icon={sound ? 'volume-2' : 'volume-x'} label="Beat tick sound" active={sound} onPress={() => setSound((s) => !s)} />
        </View>
        <SegmentedControl label="Speed" hideLabel options={SPEED_OPTIONS} value={String(snap.speed)} onChange={(v) => clock.setSpeed(Number(v))} />
        <View style={styles.cameraRow}>
          <View style={styles.cameraMode}>
            <SegmentedControl label="Camera" hideLabel options={CAMERA_OPTIONS} value={cameraMode} onChange={(v) => setCameraMode(v)} />
          </View>
          <View style={styles.presets}>
            <SegmentedControl
              label="Preset view"
              hideLabel
              options={PRESETS}
              value={cameraMode === 'observer' ? preset : undefined}
              disabled={cameraMode !== 'observer'}
              onChange={(v) => {
                // Pressing the current preset again re-applies it (after orbiting away).
                setPreset(v);
                setPresetNonce((n) => n + 1);
              }}
            />
          </View>
        </View>
        </View>
      </View>
    </View>
  );
}

function LegendDot({ color, label }: { color: string; label: string }) {
  return (
    <View style={styles.legendItem}>
      <View style={[styles.dot, { backgroundColor: color }]} />
      <Text variant="caption" tone="muted">
        {label}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: scenePalette.background, overflow: 'hidden' },
  stage: { flex: 1, minHeight: 220 },
  overlay: { padding: spacing.sm, gap: spacing.xs, width: '100%', maxWidth: 640 },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, paddingHorizontal: spacing.md, paddingVertical: spacing.sm },
  titleText: { flex: 1, minWidth: 0 },
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, paddingHorizontal: spacing.xs },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
  dot: { width: 8, height: 8, borderRadius: 4 },
  panel: {
    backgroundColor: colors.background, borderTopWidth: 1, borderColor: colors.border,
    paddingHorizontal: spacing.md, paddingTop: spacing.sm, paddingBottom: spacing.md,
    borderTopLeftRadius: radii.lg, borderTopRightRadius: radii.lg,
  },
  panelInner: { width: '100%', maxWidth: 760, alignSelf: 'center', gap: spacing.sm },
  panelCompact: { gap: spacing.xs },
  transport: { flexDirection: 'row', alignItems: 'center', justifyContent: 'center', gap: spacing.md },
  cameraRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm, justifyContent: 'space-between' },
  cameraMode: { flexGrow: 1, minWidth: 200 },
  presets: { flexGrow: 1, minWidth: 200 },
});
