/**
 * The composer's limb-sweep primitives: what a planner edits and a trainee reads as a cue.
 * Each compiles to the engine's move/harmonic/hold steps on the standard human model's dofs
 * (compile-primitives.ts). Angles in degrees, times in seconds. Names are Holonaut's own:
 * arm orbit, arm loop, leg pedal, hip swirl, pose shift, pause.
 */
import { z } from 'zod';

const finite = (what: string) =>
  z.number({ error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be a finite number`) });

/** Whole cycles of a repeated sweep: 1–100 (whole, so every sweep ends where it began). */
export const cyclesSchema = finite('cycles').int('cycles must be a whole number').min(1, 'cycles must be at least 1').max(100, 'cycles must be at most 100');
/** Seconds per cycle: 0.3–30 s. */
export const periodSchema = finite('period').min(0.3, 'period must be at least 0.3 s').max(30, 'period must be at most 30 s');
/** A plain duration: 0.1–120 s. */
export const durationSchema = finite('duration').min(0.1, 'duration must be at least 0.1 s').max(120, 'duration must be at most 120 s');

/** Which arms move. Both arms always move as mirror images (anatomical angles equal on both sides). */
export const armsSchema = z.enum(['left', 'right', 'both']);
/** Which legs move. */
export const legsSchema = z.enum(['left', 'right', 'both']);

/**
 * Where an arm orbit's cone is centred, as a preset of shoulder angles (flexion, abduction) or
 * `custom` with `centreFlexDeg`/`centreAbdDeg`. Presets keep the cone's inner edge at the body's
 * midplane (abduction centre = half-angle) because shoulder abduction below 0° is blocked by the
 * trunk: `low_forward` flexion 45°, `forward` 90°, `high_forward` 135°, `forward_out` 90° with
 * abduction 45° (or the half-angle when larger).
 */
export const ARM_ORBIT_CENTRES = ['low_forward', 'forward', 'high_forward', 'forward_out', 'custom'] as const;

/**
 * Arm orbit: the straight arm's long axis sweeps a cone at the shoulder (flexion and abduction
 * oscillate a quarter cycle apart, each by `halfAngleDeg`). `travel`: at the top of the circle the
 * hand moves `outward` (away from the midline) or `inward`.
 */
export const armOrbitSchema = z.object({
  kind: z.literal('arm_orbit'),
  arms: armsSchema,
  centre: z.enum(ARM_ORBIT_CENTRES),
  /** Shoulder flexion at the cone's centre, degrees (only for `centre: 'custom'`). */
  centreFlexDeg: finite('centreFlexDeg').min(-60).max(180).optional(),
  /** Shoulder abduction at the cone's centre, degrees (only for `centre: 'custom'`). */
  centreAbdDeg: finite('centreAbdDeg').min(0).max(180).optional(),
  /** Cone half-angle, degrees, 2–60. */
  halfAngleDeg: finite('halfAngleDeg').min(2, 'halfAngleDeg must be at least 2°').max(60, 'halfAngleDeg must be at most 60°'),
  travel: z.enum(['outward', 'inward']),
  /**
   * With both arms: `mirror` (default) circles them as mirror images (their turning effects about
   * the long and front–back axes cancel); `same_way` circles them the same way round as seen from
   * the front (the right arm's travel reversed), so those effects add and the pitch effect cancels.
   */
  pairing: z.enum(['mirror', 'same_way']).optional(),
  cycles: cyclesSchema,
  periodS: periodSchema,
});

/**
 * Body planes for an arm loop: `sagittal` (front–back, arms forward), `frontal` (side plane,
 * arms out to the side) and `horizontal` (arms forward at shoulder height, sweeping sideways).
 */
export const ARM_LOOP_PLANES = ['sagittal', 'frontal', 'horizontal'] as const;

/**
 * Arm loop: the upper arm swings back and forth in a body plane by ±`swingDeg` while the elbow
 * bends and straightens by ±`elbowDeg` a quarter cycle apart, so the hand traces a closed loop.
 * `bendOn`: the elbow is most bent during the `forward_swing` (swing angle increasing) or the
 * `return_swing`; the two are the same loop travelled in opposite senses.
 */
export const armLoopSchema = z.object({
  kind: z.literal('arm_loop'),
  arms: armsSchema,
  plane: z.enum(ARM_LOOP_PLANES),
  /** Upper-arm swing amplitude, degrees, 5–60. */
  swingDeg: finite('swingDeg').min(5, 'swingDeg must be at least 5°').max(60, 'swingDeg must be at most 60°'),
  /** Elbow bend amplitude, degrees, 5–60 (the elbow works between 10° and 10° + 2·elbowDeg). */
  elbowDeg: finite('elbowDeg').min(5, 'elbowDeg must be at least 5°').max(60, 'elbowDeg must be at most 60°'),
  bendOn: z.enum(['forward_swing', 'return_swing']),
  cycles: cyclesSchema,
  periodS: periodSchema,
});

/**
 * Leg pedal: hip flexion oscillates by ±`hipSwingDeg` about `hipCentreDeg` and the knee by
 * ±`kneeSwingDeg` about `kneeCentreDeg`, a quarter cycle apart, so each foot traces a loop
 * (`forward`: the knee's bend peaks a quarter cycle before the hip's flexion peaks; `backward`: a
 * quarter cycle after). With both legs: `alternating` (half a cycle apart) or `together`.
 */
export const legPedalSchema = z.object({
  kind: z.literal('leg_pedal'),
  legs: legsSchema,
  pattern: z.enum(['alternating', 'together']),
  /** Hip flexion at the loop's centre, degrees. */
  hipCentreDeg: finite('hipCentreDeg').min(-15).max(125),
  /** Hip flexion amplitude, degrees, 5–60. */
  hipSwingDeg: finite('hipSwingDeg').min(5, 'hipSwingDeg must be at least 5°').max(60, 'hipSwingDeg must be at most 60°'),
  /** Knee flexion at the loop's centre, degrees. */
  kneeCentreDeg: finite('kneeCentreDeg').min(0).max(130),
  /** Knee flexion amplitude, degrees, 0–65 (0: straight-legged kicks). */
  kneeSwingDeg: finite('kneeSwingDeg').min(0).max(65),
  direction: z.enum(['forward', 'backward']),
  cycles: cyclesSchema,
  periodS: periodSchema,
});

/**
 * Hip swirl: both legs held together and straight sweep a cone at the hips (hip flexion about
 * `centreFlexDeg` and a sideways swing of both legs, each by `halfAngleDeg`, a quarter cycle
 * apart). `turn`: at the front of the circle the feet move `to_left` (the person's left) or `to_right`.
 */
export const hipSwirlSchema = z.object({
  kind: z.literal('hip_swirl'),
  /** Cone half-angle, degrees, 3–40. */
  halfAngleDeg: finite('halfAngleDeg').min(3, 'halfAngleDeg must be at least 3°').max(40, 'halfAngleDeg must be at most 40°'),
  /** Hip flexion at the cone's centre, degrees (hyperextension stops at −15°, so keep it ≥ half-angle − 15°). */
  centreFlexDeg: finite('centreFlexDeg').min(-15).max(125),
  turn: z.enum(['to_left', 'to_right']),
  cycles: cyclesSchema,
  periodS: periodSchema,
});

/** Named postures a pose shift can go to (see named-postures.ts), or `custom`. */
export const POSTURE_NAMES = ['reference', 'relaxed_float', 'arms_forward', 'arms_overhead', 'arms_out', 'tuck'] as const;
/** A named posture. */
export type PostureName = (typeof POSTURE_NAMES)[number];

/**
 * Pose shift: a smooth (minimum-jerk) blend over `durationS` to a named posture (every dof goes
 * to the posture's angle, 0° where the posture does not list it) or to `custom` angles (only the
 * listed dofs move; the rest stay).
 */
export const poseShiftSchema = z.object({
  kind: z.literal('pose_shift'),
  posture: z.enum([...POSTURE_NAMES, 'custom']),
  /** Target angles by dof name, degrees (only for `posture: 'custom'`). */
  custom: z.record(z.string(), finite('angle').min(-360).max(360)).optional(),
  durationS: durationSchema,
});

/** Pause: nothing moves for `durationS`. */
export const pauseSchema = z.object({
  kind: z.literal('pause'),
  durationS: durationSchema,
});

/**
 * Recorded sweep: an imported joint-angle recording (its frames copied in, so a saved version never
 * changes when the recording is re-mapped), trimmed to [trimStartS, trimEndS] and played `repeat`
 * times; a blend joins each repetition when it does not start where the previous step ended.
 * Compiles to `track` steps (natural cubic spline through the frames).
 */
export const recordedSweepSchema = z.object({
  kind: z.literal('recorded_sweep'),
  recordingId: z.string().uuid('recordingId must be a recording id'),
  recordingName: z.string().max(200),
  /** Frames per second of `frames`, 1–1000 Hz. */
  rateHz: finite('rateHz').min(1, 'rateHz must be at least 1 Hz').max(1000, 'rateHz must be at most 1000 Hz'),
  dofs: z.array(z.string().min(1)).min(1, 'the recording has no dofs'),
  /** Degrees, one value per dof, frame k at k/rateHz s. */
  frames: z.array(z.array(finite('frame value').min(-3600).max(3600))).min(4, 'the recording needs at least 4 frames'),
  /** Seconds from the recording's start. */
  trimStartS: finite('trimStartS').min(0, 'trimStartS must be ≥ 0'),
  trimEndS: finite('trimEndS').positive('trimEndS must be positive'),
  repeat: finite('repeat').int('repeat must be a whole number').min(1, 'repeat must be at least 1').max(20, 'repeat must be at most 20'),
});

/** One composer primitive. */
export const primitiveSchema = z
  .discriminatedUnion('kind', [armOrbitSchema, armLoopSchema, legPedalSchema, hipSwirlSchema, poseShiftSchema, pauseSchema, recordedSweepSchema], {
    error: "primitive kind must be 'arm_orbit', 'arm_loop', 'leg_pedal', 'hip_swirl', 'pose_shift', 'pause' or 'recorded_sweep'",
  })
  .superRefine((p, ctx) => {
    // Fields that only some choices need.
    if (p.kind === 'arm_orbit' && p.centre === 'custom') {
      if (p.centreFlexDeg === undefined) ctx.addIssue({ code: 'custom', path: ['centreFlexDeg'], message: 'centreFlexDeg is required for a custom centre' });
      if (p.centreAbdDeg === undefined) ctx.addIssue({ code: 'custom', path: ['centreAbdDeg'], message: 'centreAbdDeg is required for a custom centre' });
    }
    if (p.kind === 'pose_shift' && p.posture === 'custom' && (!p.custom || Object.keys(p.custom).length === 0)) {
      ctx.addIssue({ code: 'custom', path: ['custom'], message: 'a custom posture needs at least one dof angle' });
    }
    if (p.kind === 'recorded_sweep') {
      const bad = p.frames.findIndex((f) => f.length !== p.dofs.length);
      if (bad >= 0) ctx.addIssue({ code: 'custom', path: ['frames', bad], message: `frame ${bad} has ${p.frames[bad].length} values but the recording has ${p.dofs.length} dofs` });
      const total = (p.frames.length - 1) / p.rateHz;
      if (p.trimEndS > total + 1e-9) ctx.addIssue({ code: 'custom', path: ['trimEndS'], message: `trimEndS must be at most the recording's ${Math.round(total * 1000) / 1000} s` });
      if (trimmedFrameRange(p).count < 4) ctx.addIssue({ code: 'custom', path: ['trimEndS'], message: 'the trimmed recording must keep at least 4 frames' });
    }
  });

/** One composer primitive. */
export type Primitive = z.infer<typeof primitiveSchema>;
/** Primitive kinds. */
export type PrimitiveKind = Primitive['kind'];
/** An arm orbit. */
export type ArmOrbit = z.infer<typeof armOrbitSchema>;
/** An arm loop. */
export type ArmLoop = z.infer<typeof armLoopSchema>;
/** A leg pedal. */
export type LegPedal = z.infer<typeof legPedalSchema>;
/** A hip swirl. */
export type HipSwirl = z.infer<typeof hipSwirlSchema>;
/** A pose shift. */
export type PoseShift = z.infer<typeof poseShiftSchema>;
/** A pause. */
export type Pause = z.infer<typeof pauseSchema>;
/** A recorded sweep. */
export type RecordedSweep = z.infer<typeof recordedSweepSchema>;

/** The frames a recorded sweep's trim keeps: indices [first, first + count). */
export function trimmedFrameRange(p: Pick<RecordedSweep, 'rateHz' | 'frames' | 'trimStartS' | 'trimEndS'>): { first: number; count: number } {
  const first = Math.max(0, Math.ceil(p.trimStartS * p.rateHz - 1e-9));
  const last = Math.min(p.frames.length - 1, Math.floor(p.trimEndS * p.rateHz + 1e-9));
  return { first, count: Math.max(0, last - first + 1) };
}

/** A composed list of primitives (1–60). */
export const primitiveListSchema = z.array(primitiveSchema).min(1, 'add at least one step').max(60, 'at most 60 steps');

/** Display names of the primitive kinds. */
export const PRIMITIVE_LABELS: Record<PrimitiveKind, string> = {
  arm_orbit: 'Arm orbit',
  arm_loop: 'Arm loop',
  leg_pedal: 'Leg pedal',
  hip_swirl: 'Hip swirl',
  pose_shift: 'Pose shift',
  pause: 'Pause',
  recorded_sweep: 'Recorded sweep',
};

/** A sensible new primitive of each kind, for the composer's "add step". */
export function defaultPrimitive(kind: Exclude<PrimitiveKind, 'recorded_sweep'>): Primitive {
  switch (kind) {
    case 'arm_orbit':
      return { kind, arms: 'both', centre: 'forward', halfAngleDeg: 20, travel: 'outward', cycles: 4, periodS: 1.5 };
    case 'arm_loop':
      return { kind, arms: 'both', plane: 'sagittal', swingDeg: 30, elbowDeg: 30, bendOn: 'forward_swing', cycles: 4, periodS: 2 };
    case 'leg_pedal':
      return { kind, legs: 'both', pattern: 'alternating', hipCentreDeg: 45, hipSwingDeg: 25, kneeCentreDeg: 60, kneeSwingDeg: 30, direction: 'forward', cycles: 4, periodS: 1.5 };
    case 'hip_swirl':
      return { kind, halfAngleDeg: 15, centreFlexDeg: 20, turn: 'to_left', cycles: 4, periodS: 2 };
    case 'pose_shift':
      return { kind, posture: 'relaxed_float', durationS: 1.5 };
    case 'pause':
      return { kind, durationS: 1 };
  }
}
