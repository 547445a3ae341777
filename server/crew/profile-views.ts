import type { CrewMemberRow, ProfileVersionRow } from '../../db/schema/index.ts';
import type { CrewMemberView } from '../../shared/contracts/crew.ts';
import type { ProfileSource, ProfileVersionHeader, ProfileVersionView } from '../../shared/contracts/profile-version.ts';

/** What a crew member's list entry shows of the current profile version. */
export interface CurrentGlimpse {
  /** Whole-body mass, kg. */
  mass: number;
  suitName: string | null;
}

/** The glimpse of a full version row. */
export function glimpseOf(row: ProfileVersionRow): CurrentGlimpse {
  return { mass: row.summary.mass, suitName: row.inputs.suit?.name ?? null };
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
export function profileVersionHeader(row: ProfileVersionRow, authorName: string | null, currentVersion: number | null): ProfileVersionHeader {
  return {
    id: row.id,
    crewMemberId: row.crewMemberId,
    version: row.version,
    source: row.source as ProfileSource,
    note: row.note,
    engineVersion: row.engineVersion,
    authorName,
    createdAt: row.createdAt.toISOString(),
    mass: row.summary.mass,
    current: row.version === currentVersion,
  };
}

/** A full version: inputs, derived body and summary. */
export function profileVersionView(row: ProfileVersionRow, authorName: string | null, currentVersion: number | null): ProfileVersionView {
  return {
    ...profileVersionHeader(row, authorName, currentVersion),
    inputs: row.inputs,
    body: row.body,
    summary: row.summary,
  };
}
