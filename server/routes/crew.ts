import { Router } from 'express';
import { z } from 'zod';

import { crewMembers } from '../../db/schema/index.ts';
import {
  createCrewMemberRequestSchema, crewListQuerySchema, saveProfileRequestSchema,
} from '../../shared/contracts/crew.ts';
import type { SaveProfileResponse } from '../../shared/contracts/profile-version.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { appendProfileVersion } from '../crew/append-profile-version.ts';
import { setMemberArchived } from '../crew/archive-member.ts';
import { compareProfiles } from '../crew/compare-profiles.ts';
import { readableMember, requireCrewEditor } from '../crew/crew-access.ts';
import { getVersion, listCrewMembers, listVersions } from '../crew/crew-queries.ts';
import { deriveProfile, suitSnapshot } from '../crew/derive-profile.ts';
import { crewMemberView, glimpseOf, profileVersionHeader, profileVersionView } from '../crew/profile-views.ts';
import { conflict } from '../http/http-error.ts';
import { ReadCache, sendCachedJson } from '../http/read-cache.ts';
import { validate } from '../http/validate.ts';
import { cancelReverifications, reverificationProgress } from '../jobs/reverification-progress.ts';
import { sendRecheckJobs, staleVersionsOf } from '../maneuvers/flag-recheck.ts';

const idParams = z.object({ id: z.string().uuid('Not a valid crew member id.') });
const versionParams = idParams.extend({ version: z.coerce.number().int('Not a version number.').min(1, 'Versions start at 1.') });
const compareQuery = z.object({
  a: z.coerce.number().int().min(1, 'Versions start at 1.'),
  b: z.coerce.number().int().min(1, 'Versions start at 1.'),
});

/** File-name-safe form of a name, for the export's download name. */
function slug(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'crew-member';
}

/**
 * Crew members and their inertia profile versions. Everyone signed in reads (a trainee only their
 * own member); planners and admins create members and save versions.
 */
export function crewRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const reads = new ReadCache();

  router.get('/', validate({ query: crewListQuerySchema }), async (req, res) => {
    const { q, archived } = res.locals.query;
    await sendCachedJson(reads, req, res, async () => {
      const rows = await listCrewMembers(db, req.user!, q, archived);
      return { members: rows.map(({ member, current }) => crewMemberView(member, current)) };
    });
  });

  router.post('/', requireCrewEditor, validate({ body: createCrewMemberRequestSchema }), async (req, res) => {
    const me = req.user!;
    const input = req.body;
    const member = await db.transaction(async (tx) => {
      const [row] = await tx.insert(crewMembers).values({ name: input.name, callSign: input.callSign || null, notes: input.notes, createdBy: me.id }).returning();
      await recordAudit(tx, { actorId: me.id, action: 'crew.create', objectType: 'crew_member', objectId: row.id, detail: { name: row.name } });
      return row;
    });
    res.status(201).json({ member: crewMemberView(member, null) });
  });

  router.post('/:id/archive', requireCrewEditor, validate({ params: idParams }), async (req, res) => {
    const { id } = res.locals.params;
    await setMemberArchived(ctx, req.user!, id, true);
    res.status(204).end();
  });

  router.post('/:id/restore', requireCrewEditor, validate({ params: idParams }), async (req, res) => {
    const { id } = res.locals.params;
    await setMemberArchived(ctx, req.user!, id, false);
    res.status(204).end();
  });

  router.get('/:id', validate({ params: idParams }), async (req, res) => {
    const { id } = res.locals.params;
    await sendCachedJson(reads, req, res, async () => {
      const member = await readableMember(db, req.user!, id);
      const current = member.currentVersion ? await getVersion(db, id, member.currentVersion) : null;
      return {
        member: crewMemberView(member, current ? glimpseOf(current.version) : null),
        current: current ? profileVersionView(current.version, current.authorName, member.currentVersion) : null,
      };
    });
  });

  router.get('/:id/versions', validate({ params: idParams }), async (req, res) => {
    const { id } = res.locals.params;
    const member = await readableMember(db, req.user!, id);
    const rows = await listVersions(db, id);
    res.json({ versions: rows.map((r) => profileVersionHeader(r.version, r.authorName, member.currentVersion)) });
  });

  router.post('/:id/versions', requireCrewEditor, validate({ params: idParams, body: saveProfileRequestSchema }), async (req, res) => {
    const me = req.user!;
    const { id } = res.locals.params;
    const input = req.body;
    const member = await readableMember(db, me, id);
    const { suitId, ...form } = input.inputs;
    const suit = suitId ? await suitSnapshot(db, suitId, 'inputs.suitId') : null;
    const derived = deriveProfile(form, suit, member.name);
    const { row, flagged } = await db.transaction(async (tx) => {
      const out = await appendProfileVersion(tx, {
        crewMemberId: id, baseVersion: input.baseVersion, source: 'regression',
        inputs: derived.inputs, body: derived.body, summary: derived.summary, note: input.note, authorId: me.id,
      });
      await recordAudit(tx, { actorId: me.id, action: 'crew.save_profile', objectType: 'profile_version', objectId: out.row.id, detail: { crewMemberId: id, version: out.row.version } });
      return out;
    });
    await sendRecheckJobs(ctx, [flagged]);
    const out: SaveProfileResponse = { version: profileVersionView(row, me.name, row.version), staleVersions: await staleVersionsOf(db, [flagged]) };
    res.status(201).json(out);
  });

  router.get('/:id/versions/:version', validate({ params: versionParams }), async (req, res) => {
    const { id, version } = res.locals.params;
    const member = await readableMember(db, req.user!, id);
    const row = await getVersion(db, id, version);
    res.json({ version: profileVersionView(row.version, row.authorName, member.currentVersion) });
  });

  // The derived body as contract JSON, as a download.
  router.get('/:id/versions/:version/body.json', validate({ params: versionParams }), async (req, res) => {
    const { id, version } = res.locals.params;
    const member = await readableMember(db, req.user!, id);
    const row = await getVersion(db, id, version);
    res.attachment(`${slug(member.name)}-profile-v${version}-body.json`);
    res.type('application/json').send(JSON.stringify(row.version.body, null, 2) + '\n');
  });

  router.get('/:id/compare', validate({ params: idParams, query: compareQuery }), async (req, res) => {
    const { id } = res.locals.params;
    const { a, b } = res.locals.query;
    const member = await readableMember(db, req.user!, id);
    const [ra, rb] = await Promise.all([getVersion(db, id, a), getVersion(db, id, b)]);
    res.json({
      comparison: compareProfiles(
        profileVersionView(ra.version, ra.authorName, member.currentVersion),
        profileVersionView(rb.version, rb.authorName, member.currentVersion),
      ),
    });
  });

  // Re-verifying the member's maneuvers after their latest profile change: progress, and stop.
  router.get('/:id/reverifications', validate({ params: idParams }), async (req, res) => {
    const { id } = res.locals.params;
    await readableMember(db, req.user!, id);
    res.json(await reverificationProgress(ctx, id));
  });

  router.post('/:id/reverifications/cancel', requireCrewEditor, validate({ params: idParams }), async (req, res) => {
    const { id } = res.locals.params;
    const user = req.user!;
    await readableMember(db, user, id);
    const reason = `Cancelled by ${user.name}.`;
    const cancelled = await cancelReverifications(ctx, id, reason);
    if (!cancelled) throw conflict('Nothing is being re-verified for this crew member.', 'not_open');
    await recordAudit(db, { actorId: user.id, action: 'reverification.cancel', objectType: 'crew_member', objectId: id, detail: { cancelled, reason } });
    res.json(await reverificationProgress(ctx, id));
  });

  return router;
}
