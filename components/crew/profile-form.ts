import { z } from 'zod';

import type { SuitView } from '@/shared/contracts/crew';
import { saveProfileRequestSchema } from '@/shared/contracts/crew';
import type { ProfileVersionView } from '@/shared/contracts/profile-version';

/** The editor's schema: the API's save request without `baseVersion` (the editor adds it from the version it opened). */
export const profileFormSchema = saveProfileRequestSchema.omit({ baseVersion: true });
/** Values as the form holds them. */
export type ProfileFormValues = z.input<typeof profileFormSchema>;
/** Values after validation (defaults applied). */
export type ProfileFormOutput = z.output<typeof profileFormSchema>;

/** Segment-length fields of the editor, with labels and the landmarks (de Leva 1996). */
export const LENGTH_FIELDS = [
  { key: 'head', label: 'Head (vertex–mid-gonion)' },
  { key: 'upperTrunk', label: 'Upper trunk (suprasternale–xiphoid)' },
  { key: 'middleTrunk', label: 'Middle trunk (xiphoid–navel)' },
  { key: 'lowerTrunk', label: 'Lower trunk (navel–mid hip joints)' },
  { key: 'upperArm', label: 'Upper arm (shoulder–elbow)' },
  { key: 'forearm', label: 'Forearm (elbow–wrist)' },
  { key: 'hand', label: 'Hand (wrist–3rd metacarpale)' },
  { key: 'thigh', label: 'Thigh (hip–knee)' },
  { key: 'shank', label: 'Shank (knee–ankle)' },
  { key: 'foot', label: 'Foot (heel–toe tip)' },
  { key: 'ankleHeight', label: 'Ankle height (above the sole)' },
] as const;

/** Editor values from the current version (or a blank profile), matching its suit snapshot to a stored suit. */
export function formValuesFrom(current: ProfileVersionView | null, suits: readonly SuitView[]): ProfileFormValues {
  const i = current?.inputs;
  const suitId = i?.suit ? (suits.find((s) => s.config.id === i.suit!.id)?.id ?? null) : null;
  return {
    note: '',
    inputs: {
      sex: i?.sex ?? 'female',
      stature: i?.stature ?? (undefined as unknown as number),
      mass: i?.mass ?? (undefined as unknown as number),
      lengths: { ...(i?.lengths ?? {}) },
      biacromialBreadth: i?.biacromialBreadth,
      hipBreadth: i?.hipBreadth,
      suitId,
      gear: (i?.gear ?? []).map((g) => ({ ...g, position: [...g.position] as [number, number, number] })),
    },
  };
}
