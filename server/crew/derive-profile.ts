import { eq } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { suitConfigs } from '../../db/schema/index.ts';
import { type Body, validateBody } from '../../shared/contracts/body.ts';
import type { ProfileFormInputs } from '../../shared/contracts/crew.ts';
import type { ProfileInputs } from '../../shared/contracts/profile-inputs.ts';
import type { ProfileSummary } from '../../shared/contracts/profile-version.ts';
import { type SuitConfig, suitConfigSchema } from '../../shared/contracts/suit.ts';
import { badRequest } from '../http/http-error.ts';
import { deriveBody, MODEL_VERSION, ProfileInputError } from '../model/derive-body.ts';
import { summarizeBody } from './profile-summary.ts';

/** What a regression profile version stores. */
export interface DerivedProfile {
  /** Validated inputs with the suit snapshot embedded. */
  inputs: ProfileInputs;
  body: Body;
  summary: ProfileSummary;
}

/** The stored suit configuration with that id, as a snapshot for a profile version; 400 naming `field` if unknown. */
export async function suitSnapshot(db: Pick<Database, 'select'>, suitId: string, field: string): Promise<SuitConfig> {
  const [row] = await db.select().from(suitConfigs).where(eq(suitConfigs.id, suitId));
  if (!row) throw badRequest(`${field}: no suit configuration with that id.`, field);
  return suitConfigSchema.parse(row.config);
}

/**
 * Derives a regression profile: the standard human model from the inputs, the suit snapshot and the
 * gear; checks the result against the body contract and summarises it. Bad inputs → 400 naming
 * `inputs.<field>`.
 */
export function deriveProfile(form: Omit<ProfileFormInputs, 'suitId'>, suit: SuitConfig | null, memberName: string): DerivedProfile {
  let derivation;
  try {
    derivation = deriveBody({ ...form, suit }, { name: memberName });
  } catch (err) {
    if (err instanceof ProfileInputError) throw badRequest(`inputs.${err.message}`, `inputs.${err.field}`);
    throw err;
  }
  // The model's output must be a valid contract body; anything else is a bug worth a loud 500.
  const checked = validateBody(derivation.body);
  if (!checked.ok) throw new Error(`derived body breaks the contract: ${checked.issues.map((i) => i.message).join('; ')}`);
  return { inputs: derivation.inputs, body: checked.value, summary: summarizeBody(checked.value, MODEL_VERSION) };
}
