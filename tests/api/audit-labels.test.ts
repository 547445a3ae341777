/**
 * The audit log's object labels (server/audit/audit-labels.ts): a name for objects that have one,
 * "'Name' vN" for a maneuver version and "Name's profile vN" for a profile version (both from the
 * row they are a version of), nothing for ids that are not rows (deleted, or not an id at all).
 */
import { randomUUID } from 'node:crypto';

import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';

import { crewMembers, profileVersions, sequences, sequenceVersions } from '../../db/schema/index.ts';
import { auditObjectLabels } from '../../server/audit/audit-labels.ts';
import { PEOPLE } from '../maneuvers/maneuver-api.ts';
import { crewMemberOf, insertProfileVersion, insertVersion } from '../rehearse/rehearsal-fixture.ts';
import { testAppForFile } from '../support/test-app.ts';

const t = testAppForFile();

describe('audit object labels', () => {
  it('names sequences, versions, profile versions and crew members from their rows', async () => {
    const db = t.ctx.db;
    const crew = await crewMemberOf(db, PEOPLE.trainee);
    const pv = await insertProfileVersion(db, crew);
    const versionId = await insertVersion(db, { crewMemberId: crew, profileVersionId: pv, status: 'cleared', name: 'Label check roll' });
    const [v] = await db.select({ sequenceId: sequenceVersions.sequenceId, version: sequenceVersions.version }).from(sequenceVersions).where(eq(sequenceVersions.id, versionId));
    const [p] = await db.select({ version: profileVersions.version }).from(profileVersions).where(eq(profileVersions.id, pv));
    const [member] = await db.select({ name: crewMembers.name }).from(crewMembers).where(eq(crewMembers.id, crew));
    const [seq] = await db.select({ name: sequences.name }).from(sequences).where(eq(sequences.id, v.sequenceId));
    expect(seq.name).toBe('Label check roll');

    const gone = randomUUID();
    const labels = await auditObjectLabels(db, [
      { objectType: 'sequence', objectId: v.sequenceId },
      { objectType: 'sequence_version', objectId: versionId },
      { objectType: 'profile_version', objectId: pv },
      { objectType: 'crew_member', objectId: crew },
      { objectType: 'sequence_version', objectId: gone },
      { objectType: 'sequence', objectId: 'not-an-id' },
      { objectType: 'rehearsal', objectId: randomUUID() },
      { objectType: 'user', objectId: null },
    ]);
    expect(Object.fromEntries(labels)).toEqual({
      [`sequence:${v.sequenceId}`]: "'Label check roll'",
      [`sequence_version:${versionId}`]: `'Label check roll' v${v.version}`,
      [`profile_version:${pv}`]: `${member.name}'s profile v${p.version}`,
      [`crew_member:${crew}`]: member.name,
    });
  });
});
