/**
 * Names for the objects audit events point at, so the log reads "'Quarter turn left' v2" instead
 * of a raw id: one query per object type present in a page of events.
 */
import { eq, inArray } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, profileVersions, sequences, sequenceVersions, suitConfigs, uploads, users } from '../../db/schema/index.ts';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Map "type:id" → a short label (a name, "'Name' v3", a file name) for the objects that still exist. */
export async function auditObjectLabels(db: Database, objects: readonly { objectType: string; objectId: string | null }[]): Promise<Map<string, string>> {
  const ids = (type: string) => [...new Set(objects.filter((o) => o.objectType === type && o.objectId && UUID.test(o.objectId)).map((o) => o.objectId!))];
  const labels = new Map<string, string>();
  const put = (type: string, id: string, label: string) => labels.set(`${type}:${id}`, label);

  const seqIds = ids('sequence');
  if (seqIds.length) for (const r of await db.select({ id: sequences.id, name: sequences.name }).from(sequences).where(inArray(sequences.id, seqIds))) put('sequence', r.id, `'${r.name}'`);
  const versionIds = ids('sequence_version');
  if (versionIds.length) {
    const rows = await db
      .select({ id: sequenceVersions.id, version: sequenceVersions.version, name: sequences.name })
      .from(sequenceVersions)
      .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
      .where(inArray(sequenceVersions.id, versionIds));
    for (const r of rows) put('sequence_version', r.id, `'${r.name}' v${r.version}`);
  }
  const crewIds = ids('crew_member');
  if (crewIds.length) for (const r of await db.select({ id: crewMembers.id, name: crewMembers.name }).from(crewMembers).where(inArray(crewMembers.id, crewIds))) put('crew_member', r.id, r.name);
  const profileIds = ids('profile_version');
  if (profileIds.length) {
    const rows = await db
      .select({ id: profileVersions.id, version: profileVersions.version, name: crewMembers.name })
      .from(profileVersions)
      .innerJoin(crewMembers, eq(crewMembers.id, profileVersions.crewMemberId))
      .where(inArray(profileVersions.id, profileIds));
    for (const r of rows) put('profile_version', r.id, `${r.name}'s profile v${r.version}`);
  }
  const userIds = ids('user');
  if (userIds.length) for (const r of await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, userIds))) put('user', r.id, r.name);
  const uploadIds = ids('upload');
  if (uploadIds.length) for (const r of await db.select({ id: uploads.id, name: uploads.fileName }).from(uploads).where(inArray(uploads.id, uploadIds))) put('upload', r.id, r.name);
  const suitIds = ids('suit_config');
  if (suitIds.length) for (const r of await db.select({ id: suitConfigs.id, name: suitConfigs.name }).from(suitConfigs).where(inArray(suitConfigs.id, suitIds))) put('suit_config', r.id, r.name);
  return labels;
}
