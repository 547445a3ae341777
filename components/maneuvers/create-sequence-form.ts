import { z } from 'zod';

import type { CreateSequenceRequest } from '@/shared/contracts/maneuver';

/** A number typed into a text field: required, parsed, then checked against [min, max]. */
const numberText = (label: string, min: number, max: number) =>
  z
    .string()
    .trim()
    .min(1, `${label} is required`)
    .transform((s) => Number(s.replace(',', '.').replace('−', '-')))
    .pipe(z.number({ error: `${label} must be a number` }).min(min, `${label} must be at least ${min}`).max(max, `${label} must be at most ${max}`));

/** Optional number text: blank means "none". */
const optionalNumberText = (label: string, min: number, max: number) =>
  z
    .string()
    .trim()
    .transform((s) => (s === '' ? null : Number(s.replace(',', '.'))))
    .pipe(z.number({ error: `${label} must be a number` }).min(min, `${label} must be at least ${min}`).max(max, `${label} must be at most ${max}`).nullable());

/**
 * The "new maneuver" form: text fields validated and converted to the API's numbers. Bounds follow
 * the shared target contract (yaw/roll ±180°, pitch ±90°, angle 0–180°).
 */
export const createSequenceFormSchema = z
  .object({
    crewMemberId: z.string().min(1, 'choose a crew member'),
    name: z.string().trim().min(1, 'name is required').max(120, 'at most 120 characters'),
    mode: z.enum(['ypr', 'axis_angle']),
    yaw: z.string(),
    pitch: z.string(),
    roll: z.string(),
    axisX: z.string(),
    axisY: z.string(),
    axisZ: z.string(),
    angleDeg: z.string(),
    toleranceDeg: numberText('Tolerance', 0.01, 90),
    rateLimitDegS: numberText('Rate limit', 1, 2000),
    timeBudgetS: optionalNumberText('Time budget', 0.1, 3600),
  })
  .superRefine((v, ctx) => {
    // Only the chosen target mode's fields are checked.
    const check = (field: 'yaw' | 'pitch' | 'roll' | 'axisX' | 'axisY' | 'axisZ' | 'angleDeg', label: string, min: number, max: number) => {
      const r = numberText(label, min, max).safeParse(v[field]);
      if (!r.success) ctx.addIssue({ code: 'custom', path: [field], message: r.error.issues[0]?.message ?? `${label} is invalid` });
    };
    if (v.mode === 'ypr') {
      check('yaw', 'Yaw', -180, 180);
      check('pitch', 'Pitch', -90, 90);
      check('roll', 'Roll', -180, 180);
    } else {
      check('axisX', 'Axis x', -1e6, 1e6);
      check('axisY', 'Axis y', -1e6, 1e6);
      check('axisZ', 'Axis z', -1e6, 1e6);
      check('angleDeg', 'Angle', 0, 180);
      if ([v.axisX, v.axisY, v.axisZ].every((s) => Number(s) === 0)) ctx.addIssue({ code: 'custom', path: ['axisZ'], message: 'the axis must not be zero' });
    }
  });

/** What the form holds (all text). */
export type CreateSequenceFormInput = z.input<typeof createSequenceFormSchema>;
/** What the form yields after validation. */
export type CreateSequenceFormOutput = z.output<typeof createSequenceFormSchema>;

/** Empty form: yaw/pitch/roll mode, 2° tolerance, 180 °/s rate limit (the contract's defaults). */
export const EMPTY_CREATE_SEQUENCE_FORM: CreateSequenceFormInput = {
  crewMemberId: '',
  name: '',
  mode: 'ypr',
  yaw: '0',
  pitch: '0',
  roll: '0',
  axisX: '0',
  axisY: '0',
  axisZ: '1',
  angleDeg: '0',
  toleranceDeg: '2',
  rateLimitDegS: '180',
  timeBudgetS: '',
};

const num = (s: string) => Number(s.trim().replace(',', '.').replace('−', '-'));

/** The validated form as the API's create request. */
export function toCreateSequenceRequest(v: CreateSequenceFormOutput): CreateSequenceRequest {
  const limits = { toleranceDeg: v.toleranceDeg, rateLimitDegS: v.rateLimitDegS, timeBudgetS: v.timeBudgetS };
  const target: CreateSequenceRequest['target'] =
    v.mode === 'ypr'
      ? { mode: 'ypr', yprDeg: { yaw: num(v.yaw), pitch: num(v.pitch), roll: num(v.roll) }, ...limits }
      : { mode: 'axis_angle', axisAngle: { axis: [num(v.axisX), num(v.axisY), num(v.axisZ)], angleDeg: num(v.angleDeg) }, ...limits };
  return { crewMemberId: v.crewMemberId, name: v.name, target };
}
