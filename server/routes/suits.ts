import { and, asc, eq, sql } from 'drizzle-orm';
import { Router } from 'express';
import { z } from 'zod';

import { type SuitConfigRow, suitConfigs, users } from '../../db/schema/index.ts';
import type { SuitView } from '../../shared/contracts/crew.ts';
import { suitConfigSchema, updateSuitRequestSchema } from '../../shared/contracts/suit.ts';
import type { AppContext } from '../app-context.ts';
import { recordAudit } from '../audit/record-audit.ts';
import { requireCrewEditor } from '../crew/crew-access.ts';
import { badRequest, conflict, notFound } from '../http/http-error.ts';
import { validate } from '../http/validate.ts';

const idParams = z.object({ id: z.string().uuid('Not a valid suit id.') });

function suitView(row: SuitConfigRow, updatedByName: string | null): SuitView {
  return { id: row.id, config: suitConfigSchema.parse(row.config), version: row.version, updatedAt: row.updatedAt.toISOString(), updatedByName };
}

/**
 * Suit configurations: everyone signed in reads them; planners and admins edit them. Saved
 * profile versions keep their own snapshot, so an edit here affects only versions saved later.
 */
export function suitsRouter(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  // Suits with the name of whoever last edited each (both reads answer it).
  const suitsWithEditor = () => db.select({ suit: suitConfigs, by: users.name }).from(suitConfigs).leftJoin(users, eq(users.id, suitConfigs.updatedBy));

  router.get('/', async (_req, res) => {
    const rows = await suitsWithEditor().orderBy(asc(suitConfigs.name));
    res.json({ suits: rows.map((r) => suitView(r.suit, r.by)) });
  });

  router.get('/:id', validate({ params: idParams }), async (_req, res) => {
    const { id } = res.locals.params;
    const [row] = await suitsWithEditor().where(eq(suitConfigs.id, id));
    if (!row) throw notFound('Suit configuration');
    res.json({ suit: suitView(row.suit, row.by) });
  });

  router.put('/:id', requireCrewEditor, validate({ params: idParams, body: updateSuitRequestSchema }), async (req, res) => {
    const me = req.user!;
    const { id } = res.locals.params;
    const { baseVersion, ...config } = req.body;
    const [existing] = await db.select().from(suitConfigs).where(eq(suitConfigs.id, id));
    if (!existing) throw notFound('Suit configuration');
    const before = suitConfigSchema.parse(existing.config);
    if (config.id !== before.id) throw badRequest(`id: a suit's id stays "${before.id}" (profiles and CSV files refer to it).`, 'id');
    const stale = (latest: number) => conflict(
      `${before.name} changed while you were editing: you started from version ${baseVersion}, but the latest is version ${latest}. Nothing was saved; copy your changes, reload and apply them again.`,
      'stale_version',
    );
    if (existing.version !== baseVersion) throw stale(existing.version);
    const row = await db.transaction(async (tx) => {
      // The version condition in the same statement makes two saves from one read give exactly one success.
      const [updated] = await tx
        .update(suitConfigs)
        .set({ name: config.name, config, illustrative: config.illustrative, version: sql`${suitConfigs.version} + 1`, updatedBy: me.id, updatedAt: new Date() })
        .where(and(eq(suitConfigs.id, id), eq(suitConfigs.version, baseVersion)))
        .returning();
      if (!updated) throw stale(baseVersion + 1);
      await recordAudit(tx, { actorId: me.id, action: 'suit.update', objectType: 'suit_config', objectId: id, detail: { name: config.name, version: updated.version } });
      return updated;
    });
    res.json({ suit: suitView(row, me.name) });
  });

  return router;
}
