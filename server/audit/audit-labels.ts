/**
 * Names for the objects audit events point at, so the log reads "'Quarter turn left' v2" instead
 * of a raw id: one query per object type present in a page of events.
 */
import { eq, inArray } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, profileVersions, sequences, sequenceVersions, suitConfigs, uploads, users } from '../../db/schema/index.ts';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

type Labelled = { id: string; label: string };

/** For each object type that has a label: read the labels of the given ids (of the rows that still exist). */
const LABEL_READERS: Record<string, (db: Database, ids: string[]) => Promise<Labelled[]>> = {
  sequence: async (db, ids) =>
    (await db.select({ id: sequences.id, name: sequences.name }).from(sequences).where(inArray(sequences.id, ids)))
      .map((r) => ({ id: r.id, label: `'${r.name}'` })),
  sequence_version: async (db, ids) =>
    (await db
      .select({ id: sequenceVersions.id, version: sequenceVersions.version, name: sequences.name })
      .from(sequenceVersions)
      .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
      .where(inArray(sequenceVersions.id, ids)))
      .map((r) => ({ id: r.id, label: `'${r.name}' v${r.version}` })),
  crew_member: (db, ids) => db.select({ id: crewMembers.id, label: crewMembers.name }).from(crewMembers).where(inArray(crewMembers.id, ids)),
  profile_version: async (db, ids) =>
    (await db
      .select({ id: profileVersions.id, version: profileVersions.version, name: crewMembers.name })
      .from(profileVersions)
      .innerJoin(crewMembers, eq(crewMembers.id, profileVersions.crewMemberId))
      .where(inArray(profileVersions.id, ids)))
      .map((r) => ({ id: r.id, label: `${r.name}'s profile v${r.version}` })),
  user: (db, ids) => db.select({ id: users.id, label: users.name }).from(users).where(inArray(users.id, ids)),
  upload: (db, ids) => db.select({ id: uploads.id, label: uploads.fileName }).from(uploads).where(inArray(uploads.id, ids)),
  suit_config: (db, ids) => db.select({ id: suitConfigs.id, label: suitConfigs.name }).from(suitConfigs).where(inArray(suitConfigs.id, ids)),
};

/** Map "type:id" → a short label (a name, "'Name' v3", a file name) for the objects that still exist. */
export async function auditObjectLabels(db: Database, objects: readonly { objectType: string; objectId: string | null }[]): Promise<Map<string, string>> {
  const labels = new Map<string, string>();
  for (const [type, read] of Object.entries(LABEL_READERS)) {
    const ids = [...new Set(objects.filter((o) => o.objectType === type && o.objectId && UUID.test(o.objectId)).map((o) => o.objectId!))];
    if (!ids.length) continue;
    for (const r of await read(db, ids)) labels.set(`${type}:${r.id}`, r.label);
  }
  return labels;
}
