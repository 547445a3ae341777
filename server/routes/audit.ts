import { and, desc, eq, gte, lte, type SQL } from 'drizzle-orm';
import { Router } from 'express';

import { auditEvents, users } from '../../db/schema/index.ts';
import { readStored } from '../../db/stored-json.ts';
import { auditDetailSchema, auditQuerySchema } from '../../shared/contracts/team.ts';
import type { AppContext } from '../app-context.ts';
import { auditObjectLabels } from '../audit/audit-labels.ts';
import { validate } from '../http/validate.ts';

/** Admin: read the audit log, newest first, filtered by actor, action, object and time. */
export function auditRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', validate({ query: auditQuerySchema }), async (_req, res) => {
    const q = res.locals.query;
    const where: SQL[] = [];
    if (q.actorId) where.push(eq(auditEvents.actorId, q.actorId));
    if (q.action) where.push(eq(auditEvents.action, q.action));
    if (q.objectType) where.push(eq(auditEvents.objectType, q.objectType));
    if (q.objectId) where.push(eq(auditEvents.objectId, q.objectId));
    if (q.since) where.push(gte(auditEvents.at, new Date(q.since)));
    if (q.until) where.push(lte(auditEvents.at, new Date(q.until)));
    const rows = await ctx.db
      .select({ e: auditEvents, email: users.email, name: users.name })
      .from(auditEvents)
      .leftJoin(users, eq(users.id, auditEvents.actorId))
      .where(where.length ? and(...where) : undefined)
      .orderBy(desc(auditEvents.id))
      .limit(q.limit);
    const labels = await auditObjectLabels(ctx.db, rows.map(({ e }) => e));
    res.json({
      events: rows.map(({ e, email, name }) => ({
        id: e.id, at: e.at.toISOString(), actorId: e.actorId, actorEmail: email, actorName: name, action: e.action,
        objectType: e.objectType, objectId: e.objectId, objectLabel: labels.get(`${e.objectType}:${e.objectId}`) ?? null,
        detail: readStored(auditDetailSchema, e.detail, 'audit_events.detail', `audit event ${e.id}`),
      })),
    });
  });
  return router;
}
