/**
 * Plain-language cues a trainee reads while rehearsing, generated from a primitive's parameters,
 * e.g. "both arms forward, small circles outward, 4 times, 1.5 s each".
 */
import { POSTURE_LABELS } from './named-postures.ts';
import type { Primitive } from './primitive-schemas.ts';

/** Seconds as short text: 1.5 → "1.5 s", 2 → "2 s". */
export function secondsText(s: number): string {
  return `${Number(s.toFixed(2))} s`;
}

/** An angle a person can aim for: whole degrees (planner-refined values carry many decimals). */
export function degreesText(deg: number): string {
  const r = Math.round(deg);
  return `${Object.is(r, -0) ? 0 : r}°`;
}

/** Repetitions as text: "once", "twice", "4 times". */
export function timesText(n: number): string {
  return n === 1 ? 'once' : n === 2 ? 'twice' : `${n} times`;
}

/** Size word for a sweep amplitude, degrees: small ≤ 15°, medium ≤ 30°, large above. */
export function sizeWord(deg: number): 'small' | 'medium' | 'large' {
  return deg <= 15 ? 'small' : deg <= 30 ? 'medium' : 'large';
}

const limbs = (which: 'left' | 'right' | 'both', limb: 'arm' | 'leg') => (which === 'both' ? `both ${limb}s` : `${which} ${limb}`);

const ORBIT_CENTRE_WORDS = {
  low_forward: 'low and forward',
  forward: 'forward',
  high_forward: 'high and forward',
  forward_out: 'forward and out',
} as const;

const PLANE_WORDS = { sagittal: 'front-to-back', frontal: 'out to the side', horizontal: 'level, sweeping sideways' } as const;

/** The cue for one primitive. */
export function cueFor(p: Primitive): string {
  const rep = 'cycles' in p ? `, ${timesText(p.cycles)}, ${secondsText(p.periodS)} each` : '';
  switch (p.kind) {
    case 'arm_orbit': {
      const where = p.centre === 'custom' ? `raised ${degreesText(p.centreFlexDeg ?? 0)} and out ${degreesText(p.centreAbdDeg ?? 0)}` : ORBIT_CENTRE_WORDS[p.centre];
      // Same way round: the left arm's travel names the direction (the right arm's is the reverse).
      const travel = p.arms === 'both' && p.pairing === 'same_way' ? `the same way round (left arm ${p.travel})` : p.travel;
      return `${limbs(p.arms, 'arm')} ${where}, ${sizeWord(p.halfAngleDeg)} circles ${travel}${rep}`;
    }
    case 'arm_loop': {
      const elbows = p.arms === 'both' ? 'elbows bend' : 'elbow bends';
      const when = p.bendOn === 'forward_swing' ? 'on the forward swing' : 'on the return swing';
      return `${limbs(p.arms, 'arm')} loop ${PLANE_WORDS[p.plane]}, ${sizeWord(p.swingDeg)} swings, ${elbows} ${when}${rep}`;
    }
    case 'leg_pedal': {
      const how = p.legs === 'both' ? (p.pattern === 'alternating' ? ', alternating' : ', together') : '';
      return `${limbs(p.legs, 'leg')} pedal ${p.direction}${how}, ${sizeWord(p.hipSwingDeg)} strokes${rep}`;
    }
    case 'hip_swirl':
      return `legs together and straight, ${sizeWord(p.halfAngleDeg)} hip circles, feet to the ${p.turn === 'to_left' ? 'left' : 'right'} at the front${rep}`;
    case 'pose_shift': {
      const target = p.posture === 'custom'
        ? `custom posture (${Object.entries(p.custom ?? {}).map(([d, v]) => `${d} ${degreesText(v)}`).join(', ')})`
        : POSTURE_LABELS[p.posture];
      return `move smoothly to ${target} over ${secondsText(p.durationS)}`;
    }
    case 'pause':
      return `hold still for ${secondsText(p.durationS)}`;
    case 'recorded_sweep':
      return `follow the recorded sweep "${p.recordingName}" (${secondsText(Math.round((p.trimEndS - p.trimStartS) * 10) / 10)}${p.repeat > 1 ? `, ${timesText(p.repeat)}` : ''})`;
  }
}

const LEAD_IN_ARM_PLANE = { sagittal: 'forward', frontal: 'out to the side', horizontal: 'forward, shoulder high' } as const;

/**
 * The few words of a step's lead-in (the joining move into the step's start posture), e.g.
 * "get ready: arms forward". Never repeats the step's own cue: the lead-in only says where to be.
 */
export function leadInCue(p: Primitive): string {
  const arms = (which: 'left' | 'right' | 'both') => (which === 'both' ? 'arms' : `${which} arm`);
  const legs = (which: 'left' | 'right' | 'both') => (which === 'both' ? 'legs' : `${which} leg`);
  switch (p.kind) {
    case 'arm_orbit':
      return `get ready: ${arms(p.arms)} ${p.centre === 'custom' ? 'to the start' : ORBIT_CENTRE_WORDS[p.centre]}`;
    case 'arm_loop':
      return `get ready: ${arms(p.arms)} ${LEAD_IN_ARM_PLANE[p.plane]}`;
    case 'leg_pedal':
      return `get ready: ${legs(p.legs)} to the start`;
    case 'hip_swirl':
      return 'get ready: legs together';
    case 'pose_shift':
    case 'pause':
      return 'get ready';
    case 'recorded_sweep':
      return 'get ready: the recording\'s starting posture';
  }
}

/** The lead-in of a step that has no composer primitive (planner or hand-made sequences). */
export const plainLeadInCue = 'get ready: move into position';

/** How every lead-in cue begins: a stored cue worded so marks its compiled step as a lead-in. */
export const LEAD_IN_WORDS = /^get ready/i;

/** The cue of one compiled step of a primitive: a joining blend says where to be, the primitive's own motion what to do. */
export function compiledStepCue(p: Primitive, role: 'blend' | 'sweep' | 'shift' | 'pause'): string {
  return role === 'blend' ? leadInCue(p) : cueFor(p);
}

/** A cue as the start of a line: "Both arms forward, …". */
export function capitalise(cue: string): string {
  return cue.charAt(0).toUpperCase() + cue.slice(1);
}
