/**
 * The composer's form layout for each limb-sweep primitive: which fields, in which order, with
 * labels, units and choices. Validation itself is the shared primitive schema (shared/primitives);
 * this file only says how to show and convert the fields (form strings ↔ numbers).
 */
import { ARM_LOOP_PLANES, ARM_ORBIT_CENTRES, POSTURE_NAMES, type Primitive, type PrimitiveKind } from '@/shared/primitives/primitive-schemas';

/** One choice of a choice field. */
export interface FieldChoice {
  value: string;
  label: string;
}

/** A field of a primitive's form. */
export type FieldSpec =
  | {
      /** Primitive property name (also the form field name). */
      name: string;
      label: string;
      type: 'number';
      /** Unit shown in the field: "°", "s", "×". */
      unit: string;
      hint?: string;
      /** Shown only when this returns true for the current values. */
      showIf?: (values: Record<string, unknown>) => boolean;
    }
  | {
      name: string;
      label: string;
      type: 'choice';
      choices: readonly FieldChoice[];
      hint?: string;
      showIf?: (values: Record<string, unknown>) => boolean;
    };

const SIDES: readonly FieldChoice[] = [
  { value: 'both', label: 'Both' },
  { value: 'left', label: 'Left' },
  { value: 'right', label: 'Right' },
];

const CENTRE_LABELS: Record<(typeof ARM_ORBIT_CENTRES)[number], string> = {
  // The trunk blocks abduction below 0°, so presets tilt the cone out by its half-angle.
  low_forward: 'Low forward (flexion 45°, out by the half-angle)',
  forward: 'Forward (flexion 90°, out by the half-angle)',
  high_forward: 'High forward (flexion 135°, out by the half-angle)',
  forward_out: 'Forward and out (flexion 90°, abduction 45°)',
  custom: 'Custom angles',
};
const PLANE_LABELS: Record<(typeof ARM_LOOP_PLANES)[number], string> = {
  sagittal: 'Front–back (sagittal)',
  frontal: 'Side (frontal)',
  horizontal: 'Sideways at shoulder height (horizontal)',
};
/** Display names of the named postures of a pose shift. */
export const POSTURE_CHOICE_LABELS: Record<(typeof POSTURE_NAMES)[number] | 'custom', string> = {
  reference: 'Reference (standing, arms at the sides)',
  relaxed_float: 'Relaxed float',
  arms_forward: 'Arms forward',
  arms_overhead: 'Arms overhead',
  arms_out: 'Arms out to the sides',
  tuck: 'Tuck',
  custom: 'Custom joint angles',
};

const cycles: FieldSpec = { name: 'cycles', label: 'Cycles', type: 'number', unit: '×', hint: 'Whole cycles, 1–100' };
const period: FieldSpec = { name: 'periodS', label: 'Period', type: 'number', unit: 's', hint: 'Seconds per cycle, 0.3–30' };
const duration: FieldSpec = { name: 'durationS', label: 'Duration', type: 'number', unit: 's', hint: '0.1–120 s' };

/** A limb sweep's own fields, then how many cycles and how long each takes (every sweep ends with these two). */
const sweep = (...fields: FieldSpec[]): readonly FieldSpec[] => [...fields, cycles, period];

/** The fields of each primitive kind, in form order. */
export const PRIMITIVE_FIELDS: Record<PrimitiveKind, readonly FieldSpec[]> = {
  arm_orbit: sweep(
    { name: 'arms', label: 'Arms', type: 'choice', choices: SIDES },
    { name: 'centre', label: 'Cone centre', type: 'choice', choices: ARM_ORBIT_CENTRES.map((c) => ({ value: c, label: CENTRE_LABELS[c] })) },
    { name: 'centreFlexDeg', label: 'Centre flexion', type: 'number', unit: '°', hint: '−60° to 180°', showIf: (v) => v.centre === 'custom' },
    { name: 'centreAbdDeg', label: 'Centre abduction', type: 'number', unit: '°', hint: '0° to 180°', showIf: (v) => v.centre === 'custom' },
    { name: 'halfAngleDeg', label: 'Cone half-angle', type: 'number', unit: '°', hint: '2°–60°' },
    { name: 'travel', label: 'Hand at the top moves', type: 'choice', choices: [{ value: 'outward', label: 'Outward' }, { value: 'inward', label: 'Inward' }] },
    {
      name: 'pairing', label: 'Both arms circle', type: 'choice', showIf: (v) => v.arms === 'both',
      choices: [{ value: 'mirror', label: 'As mirror images' }, { value: 'same_way', label: 'The same way round (left arm sets the travel)' }],
    },
  ),
  arm_loop: sweep(
    { name: 'arms', label: 'Arms', type: 'choice', choices: SIDES },
    { name: 'plane', label: 'Body plane', type: 'choice', choices: ARM_LOOP_PLANES.map((p) => ({ value: p, label: PLANE_LABELS[p] })) },
    { name: 'swingDeg', label: 'Upper-arm swing', type: 'number', unit: '°', hint: '± amplitude, 5°–60°' },
    { name: 'elbowDeg', label: 'Elbow bend', type: 'number', unit: '°', hint: '± amplitude, 5°–60°' },
    { name: 'bendOn', label: 'Elbow most bent on the', type: 'choice', choices: [{ value: 'forward_swing', label: 'Forward swing' }, { value: 'return_swing', label: 'Return swing' }] },
  ),
  leg_pedal: sweep(
    { name: 'legs', label: 'Legs', type: 'choice', choices: SIDES },
    { name: 'pattern', label: 'Pattern', type: 'choice', choices: [{ value: 'alternating', label: 'Alternating' }, { value: 'together', label: 'Together' }], showIf: (v) => v.legs === 'both' },
    { name: 'hipCentreDeg', label: 'Hip flexion centre', type: 'number', unit: '°', hint: '−15° to 125°' },
    { name: 'hipSwingDeg', label: 'Hip swing', type: 'number', unit: '°', hint: '± amplitude, 5°–60°' },
    { name: 'kneeCentreDeg', label: 'Knee flexion centre', type: 'number', unit: '°', hint: '0°–130°' },
    { name: 'kneeSwingDeg', label: 'Knee swing', type: 'number', unit: '°', hint: '± amplitude, 0°–65°' },
    { name: 'direction', label: 'Direction', type: 'choice', choices: [{ value: 'forward', label: 'Forward' }, { value: 'backward', label: 'Backward' }] },
  ),
  hip_swirl: sweep(
    { name: 'halfAngleDeg', label: 'Cone half-angle', type: 'number', unit: '°', hint: '3°–40°' },
    { name: 'centreFlexDeg', label: 'Hip flexion centre', type: 'number', unit: '°', hint: '−15° to 125°' },
    { name: 'turn', label: 'Feet at the front move', type: 'choice', choices: [{ value: 'to_left', label: 'To the left' }, { value: 'to_right', label: 'To the right' }] },
  ),
  pose_shift: [
    { name: 'posture', label: 'Posture', type: 'choice', choices: [...POSTURE_NAMES, 'custom' as const].map((p) => ({ value: p, label: POSTURE_CHOICE_LABELS[p] })) },
    duration,
  ],
  pause: [duration],
  recorded_sweep: [
    { name: 'trimStartS', label: 'Trim start', type: 'number', unit: 's' },
    { name: 'trimEndS', label: 'Trim end', type: 'number', unit: 's' },
    { name: 'repeat', label: 'Repeat', type: 'number', unit: '×' },
  ],
};

/** One row of a custom pose shift in the form: dof name and angle text. */
export interface CustomAngleRow {
  dof: string;
  angle: string;
}

/** Form values of the step editor: strings for every field, plus the custom-angle rows. */
export type StepFormValues = Record<string, unknown> & { kind: PrimitiveKind; customRows: CustomAngleRow[] };

/** A primitive as form values (numbers become text). */
export function primitiveToForm(p: Primitive): StepFormValues {
  const values: StepFormValues = { kind: p.kind, customRows: [] };
  for (const [k, v] of Object.entries(p)) {
    if (k === 'custom' && v && typeof v === 'object') {
      values.customRows = Object.entries(v as Record<string, number>).map(([dof, angle]) => ({ dof, angle: String(angle) }));
    } else if (k !== 'kind') {
      values[k] = typeof v === 'number' ? String(v) : v;
    }
  }
  return values;
}

/** Text → number for a number field: blank is "missing" (undefined), anything else is parsed (NaN stays invalid). */
function parseNumber(text: unknown): number | undefined {
  if (typeof text === 'number') return text;
  if (typeof text !== 'string' || text.trim() === '') return undefined;
  return Number(text.trim().replace(',', '.').replace('−', '-'));
}

/** Form values → the primitive's input for the shared schema: numbers parsed, hidden fields left out. */
export function formToPrimitiveInput(values: StepFormValues): Record<string, unknown> {
  const out: Record<string, unknown> = { kind: values.kind };
  for (const f of PRIMITIVE_FIELDS[values.kind] ?? []) {
    if (f.showIf && !f.showIf(values)) continue;
    out[f.name] = f.type === 'number' ? parseNumber(values[f.name]) : values[f.name];
  }
  // Legs moving on one side have no pattern choice; the schema still wants one.
  if (values.kind === 'leg_pedal' && out.pattern === undefined) out.pattern = values.pattern ?? 'alternating';
  // A recorded sweep keeps its recording (only trim and repeat are edited here).
  if (values.kind === 'recorded_sweep') {
    for (const k of ['recordingId', 'recordingName', 'dofs', 'frames']) out[k] = values[k];
    out.rateHz = parseNumber(values.rateHz);
  }
  if (values.kind === 'pose_shift' && values.posture === 'custom') {
    const custom: Record<string, number | undefined> = {};
    for (const r of values.customRows ?? []) if (r.dof) custom[r.dof] = parseNumber(r.angle);
    out.custom = custom;
  }
  return out;
}
