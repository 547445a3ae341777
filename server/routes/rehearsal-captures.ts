/**
 * Rehearsal recordings (under /api/rehearsals): a trainee (their own rehearsal) or the staff member
 * running it attaches a joint-angle CSV or a BVH file (default mapping); the server simulates it and
 * stores the capture. Reviewers and admins sign a capture off. GET …/captures/trend lists a
 * trainee's figures over their rehearsals.
 */
import { and, desc, eq } from 'drizzle-orm';
import type { Router } from 'express';
import { z } from 'zod';

import { rehearsalCaptures, rehearsals, sequences, sequenceVersions, uploadRows, uploads, users } from '../../db/schema/index.ts';
import { readStored } from '../../db/stored-json.ts';
import type { SessionUser } from '../../shared/contracts/auth.ts';
import { captureSignOffSchema, type CaptureTrendPoint, type RehearsalCapture, type StoredCapture, storedCaptureSchema } from '../../shared/contracts/recording.ts';
import type { UploadRowData } from '../../shared/contracts/uploads.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { conflict, forbidden, HttpError, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';
import { loadStoredVersion } from '../maneuvers/stored-version.ts';
import { readBvh } from '../recordings/bvh-file.ts';
import { defaultBvhMapping } from '../recordings/bvh-mapping.ts';
import { bvhTrack } from '../recordings/bvh-track.ts';
import { readJointAngleCsv } from '../recordings/joint-angle-csv.ts';
import { buildCapture } from '../recordings/rehearsal-capture.ts';
import { receiveFile } from '../uploads/receive-file.ts';
import { rejectUpload } from '../uploads/reject-upload.ts';
import { storeRawFile, uploadValues } from '../uploads/stored-file.ts';

const idParams = z.object({ id: z.string().uuid('Not a valid rehearsal id.') });
const trendQuery = z.object({ traineeId: z.string().uuid('Not a valid trainee id.').optional() });

/** The rehearsal row, if the user may see it (a trainee: only their own). */
async function visibleRehearsal(ctx: AppContext, me: SessionUser, id: string) {
  const [r] = await ctx.db.select().from(rehearsals).where(eq(rehearsals.id, id));
  if (!r || (me.role === 'trainee' && r.traineeId !== me.id)) throw notFound('Rehearsal');
  return r;
}

/** The columns a capture is shown from (not the executed track: the capture holds what screens need). */
const captureColumns = {
  id: rehearsalCaptures.id, capture: rehearsalCaptures.capture,
  signedOffBy: rehearsalCaptures.signedOffBy, signedOffAt: rehearsalCaptures.signedOffAt, signOffNote: rehearsalCaptures.signOffNote,
};

/** A capture row's stored JSON, parsed once where it is read (an unreadable value names the row). */
const readCapture = (c: { id: string; capture: unknown }): StoredCapture => readStored(storedCaptureSchema, c.capture, 'rehearsal_captures.capture', `rehearsal capture ${c.id}`);

/** The stored capture with its sign-off. */
async function captureOf(ctx: AppContext, rehearsalId: string): Promise<RehearsalCapture | null> {
  const [row] = await ctx.db.select({ c: captureColumns, signer: users.name }).from(rehearsalCaptures)
    .leftJoin(users, eq(users.id, rehearsalCaptures.signedOffBy)).where(eq(rehearsalCaptures.rehearsalId, rehearsalId));
  if (!row) return null;
  const c = row.c;
  const signedOff = c.signedOffBy && c.signedOffAt ? { by: c.signedOffBy, byName: row.signer ?? '', at: c.signedOffAt.toISOString(), note: c.signOffNote ?? '' } : null;
  return { ...readCapture(c), signedOff };
}

/** Adds the capture routes to the rehearsals router. */
export function mountRehearsalCaptures(router: Router, ctx: AppContext): void {
  const { db } = ctx;

  router.get('/captures/trend', validate({ query: trendQuery }), async (req, res) => {
    const me = req.user!;
    const { traineeId } = res.locals.query;
    const who = me.role === 'trainee' ? me.id : traineeId;
    const rows = await db.select({ c: captureColumns, r: rehearsals, name: sequences.name, version: sequenceVersions.version })
      .from(rehearsalCaptures)
      .innerJoin(rehearsals, eq(rehearsals.id, rehearsalCaptures.rehearsalId))
      .innerJoin(sequenceVersions, eq(sequenceVersions.id, rehearsals.sequenceVersionId))
      .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
      .where(who ? eq(rehearsals.traineeId, who) : undefined)
      .orderBy(desc(rehearsals.performedAt)).limit(200);
    const mean = (xs: number[]) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : null);
    const points: CaptureTrendPoint[] = rows.map(({ c, r, name, version }) => {
      const cap = readCapture(c);
      return {
        rehearsalId: r.id, performedAt: r.performedAt.toISOString(), sequenceName: name, version,
        errorToTargetDeg: cap.outcomes.find((o) => o.role === 'plan')?.errorToTargetDeg ?? NaN,
        meanPhaseLagS: mean(cap.steps.map((s) => s.phaseLagS)), meanAmplitudeRatio: mean(cap.steps.map((s) => s.amplitudeRatio)),
        meanPeriodRatio: mean(cap.steps.map((s) => s.periodRatio)), signedOff: c.signedOffBy !== null,
      };
    });
    res.json({ points });
  });

  router.get('/:id/recording', validate({ params: idParams }), async (req, res) => {
    const { id } = res.locals.params;
    await visibleRehearsal(ctx, req.user!, id);
    const capture = await captureOf(ctx, id);
    if (!capture) throw notFound('Recording for this rehearsal');
    res.json({ capture });
  });

  router.post('/:id/recording', receiveFile(['.csv', '.bvh']), validate({ params: idParams }), async (req, res) => {
    const me = req.user!;
    const { id } = res.locals.params;
    const r = await visibleRehearsal(ctx, me, id);
    const [existing] = await db.select({ id: rehearsalCaptures.id }).from(rehearsalCaptures).where(eq(rehearsalCaptures.rehearsalId, id));
    if (existing) throw conflict('This rehearsal already has a recording; log a new rehearsal for another run.', 'recording_exists');
    const v = await loadStoredVersion(db, r.sequenceVersionId);
    if (!v) throw notFound('Sequence version');
    const isBvh = req.file!.originalname.toLowerCase().endsWith('.bvh');
    const file = await storeRawFile(ctx, isBvh ? 'bvh' : 'joint_angles_csv', req.file!);

    // Parse all or nothing.
    let track: { rateHz: number; dofs: string[]; frames: number[][]; assumptions: string[] };
    let rows: { row: number; data: UploadRowData }[];
    if (isBvh) {
      const read = readBvh(file.text);
      if (!read.motion) return rejectUpload(ctx, res, file, 0, read.errors, me.id);
      const t = bvhTrack(read.motion, defaultBvhMapping(read.motion.joints.map((j) => j.name)));
      if (!t.ok) return rejectUpload(ctx, res, file, read.motion.frameCount, t.issues.map((reason) => ({ row: 0, column: 'mapping', reason })), me.id);
      track = t;
      rows = t.frames.map((f, k) => ({ row: k + 1, data: Object.fromEntries(t.dofs.map((d, j) => [d, f[j]])) }));
    } else {
      const t = readJointAngleCsv(file.text);
      if (t.errors.length) return rejectUpload(ctx, res, file, t.rows.length, t.errors, me.id);
      track = t;
      rows = t.rows.map((x) => ({ row: x.row, data: x.cells }));
    }

    // Simulate before writing anything: a recording that does not fit the body is rejected whole.
    let capture;
    try {
      capture = await buildCapture(db, ctx.simulation.product, v, track, { rehearsalId: id, uploadId: file.id, fileName: file.fileName, assumptions: track.assumptions, createdAt: new Date() });
    } catch (err) {
      if (err instanceof HttpError && err.status === 422) {
        return rejectUpload(ctx, res, file, rows.length, [{ row: 0, column: 'file', reason: err.message }], me.id);
      }
      throw err;
    }
    await db.transaction(async (tx) => {
      await tx.insert(uploads).values(uploadValues(file, 'imported', rows.length, [], me.id));
      for (let k = 0; k < rows.length; k += 1000) {
        await tx.insert(uploadRows).values(rows.slice(k, k + 1000).map((x) => ({ uploadId: file.id, rowNumber: x.row, data: x.data })));
      }
      await tx.insert(rehearsalCaptures).values({ rehearsalId: id, uploadId: file.id, rateHz: track.rateHz, dofs: track.dofs, frames: track.frames, capture, createdBy: me.id });
      await recordAudit(tx, { actorId: me.id, action: 'rehearsal.recording', objectType: 'rehearsal', objectId: id, detail: { fileName: file.fileName, frames: track.frames.length } });
    });
    res.status(201).json({ capture: { ...capture, signedOff: null } satisfies RehearsalCapture });
  });

  router.post('/:id/recording/sign-off', validate({ params: idParams, body: captureSignOffSchema }), async (req, res) => {
    const me = req.user!;
    if (me.role !== 'reviewer' && me.role !== 'admin') throw forbidden('Only reviewers sign off rehearsal recordings.');
    const { id } = res.locals.params;
    const { note } = req.body;
    await db.transaction(async (tx) => {
      const updated = await tx.update(rehearsalCaptures).set({ signedOffBy: me.id, signedOffAt: new Date(), signOffNote: note })
        .where(and(eq(rehearsalCaptures.rehearsalId, id))).returning({ id: rehearsalCaptures.id });
      if (!updated.length) throw notFound('Recording for this rehearsal');
      await recordAudit(tx, { actorId: me.id, action: 'rehearsal.sign_off', objectType: 'rehearsal', objectId: id, detail: { note } });
    });
    res.json({ capture: await captureOf(ctx, id) });
  });
}
