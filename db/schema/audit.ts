import { bigserial, index, jsonb, pgTable, text, uuid } from 'drizzle-orm/pg-core';

import type { AuditDetail } from '../../shared/contracts/team.ts';
import { instant } from './columns.ts';

/** Append-only record of who did what to which object (a trigger refuses UPDATE and DELETE). */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    at: instant('at').notNull().defaultNow(),
    actorId: uuid('actor_id'),
    action: text('action').notNull(),
    objectType: text('object_type').notNull(),
    objectId: text('object_id'),
    detail: jsonb('detail').$type<AuditDetail>().notNull().default({}),
  },
  (t) => [index('audit_events_at_idx').on(t.at), index('audit_events_object_idx').on(t.objectType, t.objectId)],
);

export type AuditEventRow = typeof auditEvents.$inferSelect;
