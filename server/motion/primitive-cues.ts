/**
 * Cues per compiled step from the composer's primitives: recompiles the stored primitive list for the
 * body to get its step map (compiled step → primitive), then words each step with the primitive's cue.
 * Returns [] when the primitives do not reproduce the stored steps (the timeline then words the steps itself).
 */
import type { Body } from '../../shared/contracts/body.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import { compilePrimitives, dofInfoFromBody, type StepOrigin } from '../../shared/primitives/compile-primitives.ts';
import { cueFor } from '../../shared/primitives/primitive-cues.ts';
import { primitiveListSchema } from '../../shared/primitives/primitive-schemas.ts';

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** The step map (compiled step → primitive) of `sequence`, recompiled from the primitives; null when they do not reproduce its steps. */
export function primitiveStepMap(primitives: unknown, body: Body, sequence: Sequence): StepOrigin[] | null {
  const parsed = primitiveListSchema.safeParse(primitives);
  if (!parsed.success) return null;
  const compiled = compilePrimitives(parsed.data, dofInfoFromBody(body), sequence.start);
  if (compiled.errors.length || compiled.steps.length !== sequence.steps.length) return null;
  if (compiled.steps.some((s, i) => s.kind !== sequence.steps[i].kind)) return null;
  return compiled.stepMap;
}

/** One cue per step of `sequence`, or [] when the primitives cannot be mapped onto its steps. */
export function primitiveCues(primitives: unknown, body: Body, sequence: Sequence): string[] {
  const parsed = primitiveListSchema.safeParse(primitives);
  const stepMap = primitiveStepMap(primitives, body, sequence);
  if (!parsed.success || !stepMap) return [];
  return stepMap.map((origin) => {
    const cue = cueFor(parsed.data[origin.primitive]);
    return origin.role === 'blend' ? `Get into position: ${cue}` : capitalise(cue);
  });
}
