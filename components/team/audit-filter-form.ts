import { z } from 'zod';

import type { AuditFilters } from '@/components/api/use-audit';

const day = z
  .string()
  .trim()
  .refine((s) => s === '' || (/^\d{4}-\d{2}-\d{2}$/.test(s) && !Number.isNaN(Date.parse(`${s}T00:00:00Z`))), 'Use a date like 2025-03-14.');

/** The audit filter form as typed: strings, dates as YYYY-MM-DD (UTC days), empty = any. */
export const auditFilterFormSchema = z
  .object({
    action: z.string().trim().max(80),
    objectType: z.string().trim().max(40),
    actorId: z.string(),
    since: day,
    until: day,
    limit: z.string().trim().refine((s) => s === '' || (/^\d+$/.test(s) && +s >= 1 && +s <= 500), 'A whole number from 1 to 500.'),
  })
  .refine((v) => !v.since || !v.until || v.since <= v.until, { message: 'The end date is before the start date.', path: ['until'] });
export type AuditFilterForm = z.infer<typeof auditFilterFormSchema>;

/** An empty form: everything, newest 100. */
export const EMPTY_AUDIT_FILTER_FORM: AuditFilterForm = { action: '', objectType: '', actorId: '', since: '', until: '', limit: '100' };

/** Form values → API query: whole UTC days become ISO instants (since 00:00:00.000, until 23:59:59.999). */
export function toAuditFilters(v: AuditFilterForm): AuditFilters {
  return {
    action: v.action || undefined,
    objectType: v.objectType || undefined,
    actorId: v.actorId || undefined,
    since: v.since ? `${v.since}T00:00:00.000Z` : undefined,
    until: v.until ? `${v.until}T23:59:59.999Z` : undefined,
    limit: v.limit ? Number(v.limit) : undefined,
  };
}

/** How many filters are set (for the phone's "Filters (n)" toggle). */
export function countActiveFilters(v: AuditFilterForm): number {
  return (['action', 'objectType', 'actorId', 'since', 'until'] as const).filter((k) => v[k] !== '').length;
}
