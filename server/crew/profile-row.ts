/**
 * The JSON of a profile_versions row, read once where the row is read: the derived body, the
 * inputs it was derived from and its summary, each parsed with its shared schema. A value that
 * does not match throws StoredDataError naming the column and field.
 */
import type { ProfileVersionRow } from '../../db/schema/index.ts';
import { readStored } from '../../db/stored-json.ts';
import { type Body, bodySchema } from '../../shared/contracts/body.ts';
import { profileSummarySchema, storedProfileInputsSchema } from '../../shared/contracts/profile-stored.ts';
import type { ProfileSummary, StoredProfileInputs } from '../../shared/contracts/profile-version.ts';

export function profileBody(row: Pick<ProfileVersionRow, 'body'>): Body {
  return readStored(bodySchema, row.body, 'profile_versions.body');
}

export function profileInputs(row: Pick<ProfileVersionRow, 'inputs'>): StoredProfileInputs {
  return readStored(storedProfileInputsSchema, row.inputs, 'profile_versions.inputs');
}

export function profileSummary(row: Pick<ProfileVersionRow, 'summary'>): ProfileSummary {
  return readStored(profileSummarySchema, row.summary, 'profile_versions.summary');
}
