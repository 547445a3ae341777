/**
 * The column conventions every table shares, so each is written once: rows are keyed by a random
 * uuid the database draws, links to other rows are uuids with a foreign key, and every moment is an
 * instant (timestamptz), never a local time.
 */
import { type AnyPgColumn, timestamp, uuid } from 'drizzle-orm/pg-core';

/** The row's own id: a random uuid drawn by the database. */
export const rowId = () => uuid('id').primaryKey().defaultRandom();

/** A link to another row's id (nullable unless chained with `.notNull()`). */
export const linkTo = (name: string, target: () => AnyPgColumn) => uuid(name).references(target);

/** A moment in time, stored with its time zone. */
export const instant = (name: string) => timestamp(name, { withTimezone: true });

/** When the row was written, by the database's clock. */
export const createdAt = () => instant('created_at').notNull().defaultNow();
