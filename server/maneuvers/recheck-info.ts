/** The re-check state of stale versions, read as it is now (shared/product/recheck-status.ts). */
import { desc, inArray } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { reverifications, sequenceVersions } from '../../db/schema/index.ts';
import type { RecheckInfo } from '../../shared/product/recheck-status.ts';

/** A stale version as this reader needs it. */
export interface StaleRow {
  id: string;
  sequenceId: string;
  version: number;
  staleSince: Date | null;
}

/** RecheckInfo per version id, for the given `recheck` versions (two queries whatever their number). */
export async function recheckInfos(db: Database, stale: readonly StaleRow[]): Promise<Map<string, RecheckInfo>> {
  const out = new Map<string, RecheckInfo>();
  if (!stale.length) return out;
  const [revs, later] = await Promise.all([
    db.select({
      versionId: reverifications.sequenceVersionId, state: reverifications.state, shift: reverifications.attitudeShiftDeg, error: reverifications.error,
      from: reverifications.fromProfileVersionId, to: reverifications.toProfileVersionId,
    })
      .from(reverifications).where(inArray(reverifications.sequenceVersionId, stale.map((s) => s.id))).orderBy(desc(reverifications.createdAt)),
    db.select({ sequenceId: sequenceVersions.sequenceId, version: sequenceVersions.version, status: sequenceVersions.status, recheckOfId: sequenceVersions.recheckOfId })
      .from(sequenceVersions).where(inArray(sequenceVersions.sequenceId, [...new Set(stale.map((s) => s.sequenceId))])).orderBy(desc(sequenceVersions.version)),
  ]);
  for (const s of stale) {
    const rev = revs.find((r) => r.versionId === s.id);
    const next = later.find((l) => l.sequenceId === s.sequenceId && l.version > s.version && l.status !== 'replaced');
    out.set(s.id, {
      // A re-verification on the version's own profile is an engine change's (a profile change always brings a newer one).
      cause: rev && rev.from === rev.to ? 'engine' : 'profile',
      staleSince: s.staleSince?.toISOString() ?? null,
      reverification: rev ? { state: rev.state, attitudeShiftDeg: rev.shift, error: rev.error } : null,
      successor: next ? { version: next.version, status: next.status, automatic: next.recheckOfId === s.id } : null,
    });
  }
  return out;
}
