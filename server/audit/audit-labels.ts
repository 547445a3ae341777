/**
 * Names for the objects audit events point at, so the log reads "'Quarter turn left' v2" instead
 * of a raw id: one query per object type present in a page of events.
 */
import { eq, inArray } from 'drizzle-orm';
import type { AnyPgColumn, PgTable } from 'drizzle-orm/pg-core';

import type { Database } from '../../db/client.ts';
import { crewMembers, profileVersions, sequences, sequenceVersions, suitConfigs, uploads, users } from '../../db/schema/index.ts';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

type Labelled = { id: string; label: string };
type LabelReader = (db: Database, ids: string[]) => Promise<Labelled[]>;
type TextColumn = AnyPgColumn<{ data: string; notNull: true }>;

/** Labels held in a column of the object's own row (a name, a file name), shown as `show` words them. */
const ownColumn = (table: PgTable, id: TextColumn, label: TextColumn, show = (value: string) => value): LabelReader => async (db, ids) =>
  (await db.select({ id, label }).from(table).where(inArray(id, ids))).map((r) => ({ id: r.id, label: show(r.label) }));

/** Labels of a version row: the name on the row it is a version of, and its number. */
const versionOf = (
  version: { table: PgTable; id: TextColumn; number: AnyPgColumn<{ data: number; notNull: true }>; parentId: TextColumn },
  parent: { table: PgTable; id: TextColumn; name: TextColumn },
  label: (name: string, version: number) => string,
): LabelReader => async (db, ids) =>
  (await db
    .select({ id: version.id, version: version.number, name: parent.name })
    .from(version.table)
    .innerJoin(parent.table, eq(parent.id, version.parentId))
    .where(inArray(version.id, ids)))
    .map((r) => ({ id: r.id, label: label(r.name, r.version) }));

/** For each object type that has a label: read the labels of the given ids (of the rows that still exist). */
const LABEL_READERS: Record<string, LabelReader> = {
  sequence: ownColumn(sequences, sequences.id, sequences.name, (name) => `'${name}'`),
  sequence_version: versionOf(
    { table: sequenceVersions, id: sequenceVersions.id, number: sequenceVersions.version, parentId: sequenceVersions.sequenceId },
    { table: sequences, id: sequences.id, name: sequences.name },
    (name, v) => `'${name}' v${v}`,
  ),
  crew_member: ownColumn(crewMembers, crewMembers.id, crewMembers.name),
  profile_version: versionOf(
    { table: profileVersions, id: profileVersions.id, number: profileVersions.version, parentId: profileVersions.crewMemberId },
    { table: crewMembers, id: crewMembers.id, name: crewMembers.name },
    (name, v) => `${name}'s profile v${v}`,
  ),
  user: ownColumn(users, users.id, users.name),
  upload: ownColumn(uploads, uploads.id, uploads.fileName),
  suit_config: ownColumn(suitConfigs, suitConfigs.id, suitConfigs.name),
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
