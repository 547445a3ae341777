/**
 * GET /api/sequences/versions/:versionId/cue-card.pdf: the printable cue card of a cleared version.
 * Visibility is the version detail's (a trainee: only their own crew member's versions, 404 otherwise);
 * any status but `cleared` is 409 `not_cleared`. Each download is audited (`cue_card.download`).
 */
import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { crewMembers, profileVersions } from '../../db/schema/index.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { cueCardContent } from '../cue-card/cue-card-content.ts';
import { renderCueCard } from '../cue-card/render-cue-card.ts';
import { validate } from '../http/validate.ts';
import { readProfileBody } from '../maneuvers/stored-version.ts';
import { loadVersionDetail } from '../maneuvers/version-detail.ts';

const versionParams = z.object({ versionId: z.uuid('Not a valid id.') });

/** Builds the router (mounted inside the sequences router). */
export function cueCardRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/versions/:versionId/cue-card.pdf', validate({ params: versionParams }), async (req, res) => {
    const { versionId } = res.locals.params;
    const user = req.user!;
    const detail = await loadVersionDetail(db, user, versionId);
    const [crew] = await db.select({ callSign: crewMembers.callSign }).from(crewMembers).where(eq(crewMembers.id, detail.sequence.crewMemberId));
    // The body the version was verified for draws the step pictograms.
    const [profile] = await db.select({ body: profileVersions.body }).from(profileVersions).where(eq(profileVersions.id, detail.profileVersionId));
    const body = profile ? readProfileBody(detail.profileVersionId, profile.body) : null;
    const card = cueCardContent(detail, { callSign: crew?.callSign ?? null }, ctx.engineVersion, body);
    const pdf = await renderCueCard(card);
    await recordAudit(db, { actorId: user.id, action: 'cue_card.download', objectType: 'sequence_version', objectId: versionId, detail: { sequenceId: detail.sequenceId, version: detail.version } });
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="${card.fileName}"`,
      'Content-Length': String(pdf.length),
      'Cache-Control': 'private, no-store',
    });
    res.end(pdf);
  });

  return router;
}
