import type { CrewMemberRow, ProfileVersionRow } from '../../db/schema/index.ts';
import type { CrewMemberView } from '../../shared/contracts/crew.ts';
import type { ProfileVersionHeader, ProfileVersionView } from '../../shared/contracts/profile-version.ts';
import { profileBody, profileInputs, profileSummary } from './profile-row.ts';

/** What a crew member's list entry shows of the current profile version. */
export interface CurrentGlimpse {
  /** Whole-body mass, kg. */
  mass: number;
  suitName: string | null;
}

/** The glimpse of a full version row. */
export function glimpseOf(row: ProfileVersionRow): CurrentGlimpse {
  return { mass: profileSummary(row).mass, suitName: profileInputs(row).suit?.name ?? null };
}

/** A crew member for the API, with a glimpse of the current version (null before the first save). */
export function crewMemberView(row: CrewMemberRow, current: CurrentGlimpse | null): CrewMemberView {
  return {
    id: row.id,
    name: row.name,
    callSign: row.callSign,
    notes: row.notes,
    currentVersion: row.currentVersion,
    currentMass: current?.mass ?? null,
    currentSuit: current?.suitName ?? null,
    createdAt: row.createdAt.toISOString(),
    archivedAt: row.archivedAt?.toISOString() ?? null,
  };
}

/** A version without its body, for history lists. */
export function profileVersionHeader(row: ProfileVersionRow, authorName: string | null, currentVersion: number | null, summary = profileSummary(row)): ProfileVersionHeader {
  return {
    id: row.id,
    crewMemberId: row.crewMemberId,
    version: row.version,
    source: row.source,
    note: row.note,
    engineVersion: row.engineVersion,
    authorName,
    createdAt: row.createdAt.toISOString(),
    mass: summary.mass,
    current: row.version === currentVersion,
  };
}

/** A full version: inputs, derived body and summary. */
export function profileVersionView(row: ProfileVersionRow, authorName: string | null, currentVersion: number | null): ProfileVersionView {
  const summary = profileSummary(row);
  return {
    ...profileVersionHeader(row, authorName, currentVersion, summary),
    inputs: profileInputs(row),
    body: profileBody(row),
    summary,
  };
}
