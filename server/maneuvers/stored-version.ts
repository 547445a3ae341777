/**
 * The one reader of stored sequence versions. Every JSON value a version keeps (its target,
 * primitives, compiled steps with their cues and step map, verification report, and the bound
 * profile version's body) is parsed once, with the shared zod schemas, where the row is read: the
 * maneuvers area, the player, the cue card, rehearsals and the jobs get typed values. A stored
 * value that does not parse is a server fault: a 500 naming the row and the column, logged by the
 * error handler (or by the job that read it), never a default.
 */
import { eq } from 'drizzle-orm';
import { z } from 'zod';

import type { Database } from '../../db/client.ts';
import { crewMembers, profileVersions, sequences, sequenceVersions } from '../../db/schema/index.ts';
import { type Body, bodySchema } from '../../shared/contracts/body.ts';
import {
  checkFailureSchema, type ReportSummary, reportSummarySchema, type SequenceTarget, sequenceTargetSchema, type StoredCompiled, storedCompiledSchema,
  type VerificationReport, verificationReportSchema,
} from '../../shared/contracts/maneuver.ts';
import type { VersionStatus } from '../../shared/contracts/version-status.ts';
import { type Primitive, primitiveSchema } from '../../shared/primitives/primitive-schemas.ts';
import type { CheckFailure } from '../../shared/product/version-checks.ts';
import { HttpError } from '../http/http-error.ts';

/** A stored value that does not parse: names the row and the column (500: the fault is ours, not the caller's). */
export class UnreadableStoredValue extends HttpError {
  constructor(readonly row: string, readonly column: string, detail: string) {
    super(500, 'stored_value_unreadable', `The stored ${column} of ${row} cannot be read (${detail}).`);
  }
}

/** Parses one stored JSON value; UnreadableStoredValue naming the row, the column and the first issue's path. */
export function parseStored<S extends z.ZodType>(schema: S, json: unknown, row: string, column: string): z.output<S> {
  const parsed = schema.safeParse(json);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw new UnreadableStoredValue(row, column, `${issue.path.length ? `${issue.path.join('.')}: ` : ''}${issue.message}`);
}

/**
 * A version's primitives as stored: the composer's list, or none for a version whose steps were
 * written as an engine sequence (at least one step is the composer's rule for new saves, not the store's).
 */
const storedPrimitivesSchema = z.array(primitiveSchema);

const versionRow = (id: string) => `sequence version ${id}`;

/** A version's own target. */
export const readVersionTarget = (versionId: string, json: unknown): SequenceTarget => parseStored(sequenceTargetSchema, json, versionRow(versionId), 'target');
/** A sequence's target (the next version's default). */
export const readSequenceTarget = (sequenceId: string, json: unknown): SequenceTarget => parseStored(sequenceTargetSchema, json, `sequence ${sequenceId}`, 'target');
/** A version's compiled steps, cues and step map. */
export const readStoredCompiled = (versionId: string, json: unknown): StoredCompiled => parseStored(storedCompiledSchema, json, versionRow(versionId), 'compiled steps');
/** A version's composer primitives. */
export const readStoredPrimitives = (versionId: string, json: unknown): Primitive[] => parseStored(storedPrimitivesSchema, json, versionRow(versionId), 'primitives');
/** A version's verification report; null before verification. */
export const readStoredReport = (versionId: string, json: unknown): VerificationReport | null =>
  (json === null || json === undefined ? null : parseStored(verificationReportSchema, json, versionRow(versionId), 'verification report'));
/** A version's report summary (the columns lists read instead of the report); null before verification. */
export const readReportSummary = (versionId: string, json: unknown): ReportSummary | null =>
  (json === null || json === undefined ? null : parseStored(reportSummarySchema, json, versionRow(versionId), 'report summary'));
/** The failed checks a planner acknowledged when submitting; null when none were. */
export const readAcknowledgedFailures = (versionId: string, json: unknown): CheckFailure[] | null =>
  (json === null || json === undefined ? null : parseStored(z.array(checkFailureSchema), json, versionRow(versionId), 'acknowledged failures'));
/** A profile version's body. */
export const readProfileBody = (profileVersionId: string, json: unknown): Body => parseStored(bodySchema, json, `profile version ${profileVersionId}`, 'body');

/** A version with its sequence, crew member and bound profile body, every stored value typed. */
export interface StoredVersion {
  id: string;
  sequenceId: string;
  sequenceName: string;
  version: number;
  status: VersionStatus;
  crewMemberId: string;
  crewMemberName: string;
  /** Whether the maneuver is archived (retired from rehearsal). */
  archived: boolean;
  /** The target this version was composed and verified for. */
  target: SequenceTarget;
  compiled: StoredCompiled;
  primitives: Primitive[];
  profileVersionId: string;
  /** The bound profile version's body. */
  body: Body;
  /** The verification report (null before verification). */
  report: VerificationReport | null;
  /** Engine version that verified it (null before verification). */
  engineVersion: string | null;
  clearedAt: Date | null;
}

/** The version by id with every stored value parsed, or null; UnreadableStoredValue when one does not parse. */
export async function loadStoredVersion(db: Pick<Database, 'select'>, versionId: string): Promise<StoredVersion | null> {
  const [row] = await db
    .select({ v: sequenceVersions, s: { name: sequences.name, crewMemberId: sequences.crewMemberId, archivedAt: sequences.archivedAt }, crewName: crewMembers.name, body: profileVersions.body })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .innerJoin(crewMembers, eq(crewMembers.id, sequences.crewMemberId))
    .innerJoin(profileVersions, eq(profileVersions.id, sequenceVersions.profileVersionId))
    .where(eq(sequenceVersions.id, versionId));
  if (!row) return null;
  const { v, s } = row;
  return {
    id: v.id, sequenceId: v.sequenceId, sequenceName: s.name, version: v.version, status: v.status,
    crewMemberId: s.crewMemberId, crewMemberName: row.crewName, archived: s.archivedAt !== null,
    target: readVersionTarget(v.id, v.target), compiled: readStoredCompiled(v.id, v.compiled), primitives: readStoredPrimitives(v.id, v.primitives),
    profileVersionId: v.profileVersionId, body: readProfileBody(v.profileVersionId, row.body), report: readStoredReport(v.id, v.report),
    engineVersion: v.engineVersion, clearedAt: v.clearedAt,
  };
}

/** The few columns the visibility rule reads (no steps, no report, no body): enough to serve a cached motion. */
export interface VersionAccessRow {
  id: string;
  status: VersionStatus;
  crewMemberId: string;
  clearedAt: Date | null;
  archived: boolean;
}

/** The access columns of a version, or null. */
export async function loadVersionAccess(db: Pick<Database, 'select'>, versionId: string): Promise<VersionAccessRow | null> {
  const [row] = await db
    .select({ id: sequenceVersions.id, status: sequenceVersions.status, crewMemberId: sequences.crewMemberId, clearedAt: sequenceVersions.clearedAt, archivedAt: sequences.archivedAt })
    .from(sequenceVersions)
    .innerJoin(sequences, eq(sequences.id, sequenceVersions.sequenceId))
    .where(eq(sequenceVersions.id, versionId));
  if (!row) return null;
  const { archivedAt, ...rest } = row;
  return { ...rest, archived: archivedAt !== null };
}
