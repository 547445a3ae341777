/**
 * The limb-sweep primitives: compiled steps join, stay in range, mean what their names say
 * (checked with gl-matrix's rotations on the standard model's joint axes), carry the right cues,
 * and report bad dofs by primitive.
 */
import { glMatrix, quat, vec3 } from 'gl-matrix';
import { describe, expect, it } from 'vitest';

import { simulate } from '../../server/engine/simulate.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import { DOF_AXES } from '../../server/model/joints.ts';
import type { Body } from '../../shared/contracts/body.ts';
import { harmonicAngleDeg, type HarmonicStep, type Step, stepDuration, validateSequence } from '../../shared/contracts/sequence.ts';
import type { DofName } from '../../shared/model/dof-names.ts';
import { BLEND_SPEED_DEG_S, compilePrimitives, dofInfoFromBody, MIN_BLEND_S } from '../../shared/primitives/compile-primitives.ts';
import { cueFor } from '../../shared/primitives/primitive-cues.ts';
import { defaultPrimitive, type Primitive, type PrimitiveKind, primitiveSchema, type RecordedSweep } from '../../shared/primitives/primitive-schemas.ts';

glMatrix.setMatrixArrayType(Array);

const BODY = deriveBody({ sex: 'male', stature: 1.75, mass: 75 }).body as Body;
const DOFS = dofInfoFromBody(BODY);
const KINDS: Exclude<PrimitiveKind, 'recorded_sweep'>[] = ['arm_orbit', 'arm_loop', 'leg_pedal', 'hip_swirl', 'pose_shift', 'pause'];
/** Continuity tolerance of the sequence contract, degrees (DESIGN.md "Sequence contract"). */
const JOIN_TOL_DEG = 1e-6;

/** Angles of every dof at the end of each step, degrees, replaying the contract's rules. */
function anglesAtStepEnds(start: Record<string, number>, steps: Step[]): Map<string, number>[] {
  const cur = new Map(DOFS.map((d) => [d.name, start[d.name] ?? 0]));
  return steps.map((s) => {
    if (s.kind === 'move') for (const [k, v] of Object.entries(s.to)) cur.set(k, v);
    if (s.kind === 'harmonic') for (const [k, j] of Object.entries(s.joints)) cur.set(k, harmonicAngleDeg(j, s.period, s.cycles * s.period));
    return new Map(cur);
  });
}

/** Unit direction of a limb's long axis (−z of its segment) in the trunk frame, composed with gl-matrix quaternions. */
function limbDirection(dofs: DofName[], anglesDeg: number[]): vec3 {
  const r = quat.create();
  dofs.forEach((d, i) => {
    // Each axis is in the frame left by the previous rotations: compose on the right.
    const q = quat.setAxisAngle(quat.create(), DOF_AXES[d], (anglesDeg[i] * Math.PI) / 180);
    quat.multiply(r, r, q);
  });
  return vec3.transformQuat(vec3.create(), vec3.fromValues(0, 0, -1), r);
}

const angleBetweenDeg = (a: vec3, b: vec3) => (vec3.angle(a, b) * 180) / Math.PI;

describe('every primitive compiles to steps that join', () => {
  it.each(KINDS)('%s with defaults: the engine contract accepts it and each harmonic starts where the previous step ended (1e-6°)', (kind) => {
    // Precede it by every other kind so each starts from a different posture.
    const list: Primitive[] = [...KINDS.filter((k) => k !== kind).map(defaultPrimitive), defaultPrimitive(kind)];
    const c = compilePrimitives(list, DOFS);
    expect(c.errors).toEqual([]);
    expect(validateSequence(c.sequence, BODY).ok).toBe(true);
    const ends = anglesAtStepEnds(c.sequence.start, c.steps);
    c.steps.forEach((s, i) => {
      if (s.kind !== 'harmonic' || i === 0) return;
      for (const [dof, j] of Object.entries(s.joints)) {
        expect(Math.abs(harmonicAngleDeg(j, s.period, 0) - ends[i - 1].get(dof)!)).toBeLessThanOrEqual(JOIN_TOL_DEG);
      }
    });
  });

  it('a sweep repeated after itself needs no blend (it already ends where it starts)', () => {
    const p = defaultPrimitive('arm_orbit');
    const c = compilePrimitives([p, p], DOFS);
    expect(c.stepMap.map((s) => s.role)).toEqual(['blend', 'sweep', 'sweep']);
  });

  it('the step map covers the sequence end to end, and its total is the sum of step durations', () => {
    const c = compilePrimitives(KINDS.map(defaultPrimitive), DOFS);
    expect(c.stepMap[0].startS).toBe(0);
    c.stepMap.slice(1).forEach((s, i) => expect(s.startS).toBeCloseTo(c.stepMap[i].endS, 9));
    expect(c.durationS).toBeCloseTo(c.steps.reduce((t, s) => t + stepDuration(s), 0), 9);
    expect(new Set(c.stepMap.map((s) => s.primitive))).toEqual(new Set(KINDS.map((_, i) => i)));
  });
});

describe('ranges', () => {
  it.each(KINDS)('%s with defaults stays inside the unsuited joint ranges (no warning, no engine range violation)', (kind) => {
    const c = compilePrimitives([defaultPrimitive(kind)], DOFS);
    expect(c.warnings).toEqual([]);
    expect(simulate(BODY, c.sequence, { rateHz: 20 }).rangeViolations).toEqual([]);
  });

  it('a hip swirl centred at 0° flexion with a 20° half-angle is warned at hip hyperextension (−15°, Merck Manual ROM table)', () => {
    const c = compilePrimitives([{ kind: 'hip_swirl', halfAngleDeg: 20, centreFlexDeg: 0, turn: 'to_left', cycles: 1, periodS: 2 }], DOFS);
    expect(c.warnings.map((w) => w.message)).toContain('step 1 (Hip swirl): l_hip_flex reaches -20°, below its minimum -15°');
  });

  it('blends are minimum-jerk moves whose peak rate is 15/8·Δ/T (Flash & Hogan 1985), so ≤ 15/8 of the blend speed', () => {
    const c = compilePrimitives([{ kind: 'pose_shift', posture: 'reference', durationS: 1 }, defaultPrimitive('arm_orbit')], DOFS);
    const blend = c.steps[1];
    expect(blend.kind).toBe('move');
    const d = (blend as { duration: number }).duration;
    // From the reference posture to the orbit's start: shoulder flexion 0° → 90°.
    const prev = anglesAtStepEnds({}, c.steps)[0];
    const delta = Math.max(...Object.entries((blend as { to: Record<string, number> }).to).map(([k, v]) => Math.abs(v - prev.get(k)!)));
    expect(delta).toBe(90);
    expect(d).toBeGreaterThanOrEqual(Math.max(MIN_BLEND_S, delta / BLEND_SPEED_DEG_S) - 1e-12);
    const r = simulate(BODY, { start: Object.fromEntries(prev), steps: [blend] }, { rateHz: 200 });
    expect(r.peakJointRateDegS.max).toBeCloseTo((15 / 8) * (delta / d), 1);
  });
});

describe('what the primitives mean, checked with gl-matrix rotations', () => {
  it('arm orbit: the arm stays on a cone of the chosen half-angle about its centre (within 10%: the flexion scale shrinks by cos(abduction))', () => {
    const p: Primitive = { kind: 'arm_orbit', arms: 'left', centre: 'forward', halfAngleDeg: 10, travel: 'outward', cycles: 1, periodS: 2 };
    const sweep = compilePrimitives([p], DOFS).steps[1] as HarmonicStep;
    const centre = limbDirection(['l_sh_flex', 'l_sh_abd'], [sweep.joints.l_sh_flex.offset, sweep.joints.l_sh_abd.offset]);
    for (let k = 0; k < 12; k++) {
      const t = (k / 12) * sweep.period;
      const dir = limbDirection(['l_sh_flex', 'l_sh_abd'], [harmonicAngleDeg(sweep.joints.l_sh_flex, sweep.period, t), harmonicAngleDeg(sweep.joints.l_sh_abd, sweep.period, t)]);
      const a = angleBetweenDeg(centre, dir);
      expect(a).toBeGreaterThan(9);
      expect(a).toBeLessThan(11);
    }
  });

  it.each([['left', 'l', 1], ['right', 'r', -1]] as const)('arm orbit outward: at the top of the circle the %s hand moves away from the midline', (arms, s, sideSign) => {
    const p: Primitive = { kind: 'arm_orbit', arms, centre: 'forward', halfAngleDeg: 20, travel: 'outward', cycles: 1, periodS: 2 };
    const sweep = compilePrimitives([p], DOFS).steps[1] as HarmonicStep;
    const f = sweep.joints[`${s}_sh_flex`], ab = sweep.joints[`${s}_sh_abd`];
    const at = (t: number) => limbDirection([`${s}_sh_flex`, `${s}_sh_abd`] as DofName[], [harmonicAngleDeg(f, sweep.period, t), harmonicAngleDeg(ab, sweep.period, t)]);
    // Top of the circle: flexion at its peak, a quarter period in.
    const top = sweep.period / 4, dt = 1e-4;
    const vy = (at(top + dt)[1] - at(top - dt)[1]) / (2 * dt);
    expect(Math.sign(vy)).toBe(sideSign);
    // … and the hand is then at its highest.
    expect(at(top)[2]).toBeGreaterThan(at(top + 0.2)[2]);
  });

  it('hip swirl: both legs stay parallel (together) through the whole circle', () => {
    const sweep = compilePrimitives([defaultPrimitive('hip_swirl')], DOFS).steps[1] as HarmonicStep;
    for (let k = 0; k < 10; k++) {
      const t = (k / 10) * sweep.period;
      const ang = (d: string) => harmonicAngleDeg(sweep.joints[d], sweep.period, t);
      const l = limbDirection(['l_hip_flex', 'l_hip_abd'], [ang('l_hip_flex'), ang('l_hip_abd')]);
      const r = limbDirection(['r_hip_flex', 'r_hip_abd'], [ang('r_hip_flex'), ang('r_hip_abd')]);
      expect(angleBetweenDeg(l, r)).toBeLessThan(1e-6);
    }
  });

  it('leg pedal alternating: the right leg repeats the left half a period later; together: the same', () => {
    const alt = compilePrimitives([defaultPrimitive('leg_pedal')], DOFS).steps[1] as HarmonicStep;
    for (const t of [0, 0.3, 0.9]) {
      expect(harmonicAngleDeg(alt.joints.r_hip_flex, alt.period, t)).toBeCloseTo(harmonicAngleDeg(alt.joints.l_hip_flex, alt.period, t + alt.period / 2), 9);
      expect(harmonicAngleDeg(alt.joints.r_knee_flex, alt.period, t)).toBeCloseTo(harmonicAngleDeg(alt.joints.l_knee_flex, alt.period, t + alt.period / 2), 9);
    }
    const tog = compilePrimitives([{ ...defaultPrimitive('leg_pedal'), pattern: 'together' } as Primitive], DOFS).steps[1] as HarmonicStep;
    expect(tog.joints.r_hip_flex).toEqual(tog.joints.l_hip_flex);
  });

  it('arm loop in the sagittal plane: shoulder flexion and elbow flexion both turn about the body\'s y axis, so the hand stays in the sagittal plane', () => {
    const p: Primitive = { kind: 'arm_loop', arms: 'left', plane: 'sagittal', swingDeg: 30, elbowDeg: 30, bendOn: 'forward_swing', cycles: 1, periodS: 2 };
    const sweep = compilePrimitives([p], DOFS).steps[1] as HarmonicStep;
    expect(Object.keys(sweep.joints).sort()).toEqual(['l_elbow_flex', 'l_sh_flex']);
    expect(DOF_AXES.l_sh_flex).toEqual(DOF_AXES.l_elbow_flex);
    // A loop, not a line: the two dofs are a quarter cycle apart, so the joint path encloses area.
    expect(Math.abs(sweep.joints.l_elbow_flex.phase - sweep.joints.l_sh_flex.phase)).toBe(90);
  });

  it('opposite travel reverses the loop (same path, opposite sense): the engine turns the body the opposite way', () => {
    const out = compilePrimitives([defaultPrimitive('arm_orbit')], DOFS);
    const inn = compilePrimitives([{ ...defaultPrimitive('arm_orbit'), travel: 'inward' } as Primitive], DOFS);
    // Only the sweeps: the blends differ in where they start the circle.
    const run = (c: typeof out) => simulate(BODY, { start: Object.fromEntries(anglesAtStepEnds({}, c.steps)[0]), steps: [c.steps[1]] }, { rateHz: 10 }).final.yprDeg.pitch;
    const a = run(out), b = run(inn);
    expect(Math.abs(a)).toBeGreaterThan(0.5);
    expect(b).toBeCloseTo(-a, 6);
  });
});

describe('cues', () => {
  it('arm orbit: "both arms forward, small circles outward, 4 times, 1.5 s each"', () => {
    expect(cueFor({ kind: 'arm_orbit', arms: 'both', centre: 'forward', halfAngleDeg: 15, travel: 'outward', cycles: 4, periodS: 1.5 })).toBe('both arms forward, small circles outward, 4 times, 1.5 s each');
    // A planner-refined custom centre reads in whole degrees a person can aim for.
    expect(cueFor({ kind: 'arm_orbit', arms: 'both', centre: 'custom', centreFlexDeg: -0.3, centreAbdDeg: 14.28074280433176, halfAngleDeg: 8, travel: 'inward', pairing: 'same_way', cycles: 10, periodS: 1.2 }))
      .toBe('both arms raised 0° and out 14°, small circles the same way round (left arm inward), 10 times, 1.2 s each');
  });
  it('arm loop, one arm, once: singular elbow and "once"', () => {
    expect(cueFor({ kind: 'arm_loop', arms: 'right', plane: 'frontal', swingDeg: 40, elbowDeg: 20, bendOn: 'return_swing', cycles: 1, periodS: 2 }))
      .toBe('right arm loop out to the side, large swings, elbow bends on the return swing, once, 2 s each');
  });
  it('leg pedal: pattern only for both legs', () => {
    expect(cueFor(defaultPrimitive('leg_pedal'))).toBe('both legs pedal forward, alternating, medium strokes, 4 times, 1.5 s each');
    expect(cueFor({ ...defaultPrimitive('leg_pedal'), legs: 'left', cycles: 2 } as Primitive)).toBe('left leg pedal forward, medium strokes, twice, 1.5 s each');
  });
  it('hip swirl, pose shift and pause', () => {
    expect(cueFor(defaultPrimitive('hip_swirl'))).toBe('legs together and straight, small hip circles, feet to the left at the front, 4 times, 2 s each');
    expect(cueFor({ kind: 'pose_shift', posture: 'custom', custom: { r_sh_flex: 90 }, durationS: 1.25 })).toBe('move smoothly to custom posture (r_sh_flex 90°) over 1.25 s');
    expect(cueFor({ kind: 'pause', durationS: 2 })).toBe('hold still for 2 s');
  });
});

describe('bad input', () => {
  it('a custom posture with an unknown dof is an error naming the primitive and the dof, and nothing is compiled for it', () => {
    const c = compilePrimitives([{ kind: 'pause', durationS: 1 }, { kind: 'pose_shift', posture: 'custom', custom: { tail_wag: 10 }, durationS: 1 }], DOFS);
    expect(c.errors).toEqual([{ primitive: 1, field: 'primitives[1].custom.tail_wag', message: "step 2 (Pose shift): the body has no dof 'tail_wag'" }]);
    expect(c.stepMap.every((s) => s.primitive === 0)).toBe(true);
  });

  it('a body without legs cannot pedal: the error names the missing dof', () => {
    const armsOnly = DOFS.filter((d) => !d.name.includes('hip') && !d.name.includes('knee'));
    const c = compilePrimitives([defaultPrimitive('leg_pedal')], armsOnly);
    expect(c.errors[0].message).toMatch(/step 1 \(Leg pedal\): the body has no dof 'l_hip_flex'/);
  });

  it.each([
    [{ kind: 'arm_orbit', arms: 'both', centre: 'custom', halfAngleDeg: 10, travel: 'outward', cycles: 1, periodS: 1 }, 'centreFlexDeg'],
    [{ kind: 'pause', durationS: Number.NaN }, 'durationS'],
    [{ kind: 'leg_pedal', legs: 'both', pattern: 'together', hipCentreDeg: 40, hipSwingDeg: 20, kneeCentreDeg: 50, kneeSwingDeg: 10, direction: 'forward', cycles: 1.5, periodS: 1 }, 'cycles'],
    [{ kind: 'spin' }, 'kind'],
  ])('the schema rejects %j at field %s', (raw, field) => {
    const r = primitiveSchema.safeParse(raw);
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path.join('.')).toBe(field);
  });
});

describe('recorded sweep', () => {
  // An imported recording: 2 s of a right-arm sweep at 50 Hz (invented).
  const frames = Array.from({ length: 101 }, (_, k) => [90 + 30 * Math.sin((2 * Math.PI * k) / 50), 20 + 15 * (1 - Math.cos((2 * Math.PI * k) / 50))]);
  const sweep = (over: Partial<RecordedSweep> = {}): RecordedSweep => ({
    kind: 'recorded_sweep', recordingId: '00000000-0000-4000-8000-000000000001', recordingName: 'Expert sweep', rateHz: 50,
    dofs: ['r_sh_flex', 'r_sh_abd'], frames, trimStartS: 0.5, trimEndS: 1.3, repeat: 2, ...over,
  });

  it('trims to [0.5 s, 1.3 s] (41 frames), repeats twice with a blend before each repetition, and the engine accepts it', () => {
    expect(primitiveSchema.safeParse(sweep()).success).toBe(true);
    const c = compilePrimitives([sweep()], DOFS);
    expect(c.errors).toEqual([]);
    expect(c.steps.map((s) => s.kind)).toEqual(['move', 'track', 'move', 'track']);
    const track = c.steps[1] as Extract<Step, { kind: 'track' }>;
    expect(track.frames).toHaveLength(41);
    expect(track.frames[0]).toEqual(frames[25]);
    expect(c.stepMap.map((s) => s.role)).toEqual(['blend', 'sweep', 'blend', 'sweep']);
    expect(validateSequence(c.sequence, BODY).ok).toBe(true);
    expect(c.durationS).toBeCloseTo(c.steps.reduce((t, s) => t + stepDuration(s), 0), 9);
  });

  it('a whole-cycle trim (last frame = first) repeats without a blend between repetitions', () => {
    const c = compilePrimitives([sweep({ trimStartS: 0, trimEndS: 1, repeat: 3 })], DOFS);
    expect(c.steps.map((s) => s.kind)).toEqual(['move', 'track', 'track', 'track']);
    expect(validateSequence(c.sequence, BODY).ok).toBe(true);
  });

  it('rejects a trim keeping fewer than 4 frames and a trim past the recording\'s end, naming trimEndS', () => {
    const short = primitiveSchema.safeParse(sweep({ trimStartS: 1, trimEndS: 1.05 }));
    expect(short.success).toBe(false);
    expect(short.error!.issues.find((i) => i.path.join('.') === 'trimEndS')?.message).toMatch(/at least 4 frames/);
    const long = primitiveSchema.safeParse(sweep({ trimEndS: 3 }));
    expect(long.error!.issues.find((i) => i.path.join('.') === 'trimEndS')?.message).toMatch(/at most the recording's 2 s/);
  });

  it('warns when the recorded frames go beyond a dof range', () => {
    const c = compilePrimitives([sweep({ frames: frames.map(([a, b]) => [a + 80, b]) })], DOFS);
    expect(c.warnings.some((w) => /r_sh_flex reaches .* above its maximum/.test(w.message))).toBe(true);
  });
});
