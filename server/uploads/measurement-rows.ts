import { sql } from 'drizzle-orm';

import type { Database } from '../../db/client.ts';
import { crewMembers, suitConfigs } from '../../db/schema/index.ts';
import { profileInputsSchema, type SegmentLengths } from '../../shared/contracts/profile-inputs.ts';
import { type SuitConfig, suitConfigSchema } from '../../shared/contracts/suit.ts';
import { MEASUREMENT_COLUMNS, MEASUREMENT_LENGTH_COLUMNS, MEASUREMENT_REQUIRED, type UploadRowError } from '../../shared/contracts/uploads.ts';
import { type DerivedProfile, deriveProfile } from '../crew/derive-profile.ts';
import { HttpError } from '../http/http-error.ts';
import { type CsvRow, numberCell, readCsvTable } from './csv-table.ts';

/** One checked row of a measurements CSV, ready to import. */
export interface MeasurementPlan {
  row: number;
  name: string;
  callSign: string;
  note: string;
  /** The existing crew member of that name (a new version is added), or null (a member is created). */
  existingMemberId: string | null;
  profile: DerivedProfile;
  /** The row's cells, stored in upload_rows. */
  cells: Record<string, string>;
}

/** Profile-input field → the CSV column that carries it, for error messages. */
function columnFor(field: string): string {
  const f = field.replace(/^inputs\./, '');
  const direct: Record<string, string> = { sex: 'sex', stature: 'stature_m', mass: 'mass_kg', biacromialBreadth: 'biacromial_m', hipBreadth: 'hip_breadth_m' };
  if (direct[f]) return direct[f];
  if (f.startsWith('lengths.')) {
    const key = f.slice(8);
    const col = Object.entries(MEASUREMENT_LENGTH_COLUMNS).find(([, k]) => k === key)?.[0];
    if (col) return col;
  }
  return f;
}

/**
 * Reads and checks a measurements CSV completely, deriving every row's body, before anything is
 * written: returns the plans, or every problem found (row, column, reason). Rows match existing
 * crew members by name (case and surrounding spaces ignored).
 */
export async function planMeasurementImport(db: Database, text: string): Promise<{ plans: MeasurementPlan[]; errors: UploadRowError[]; rowCount: number }> {
  const table = readCsvTable(text, MEASUREMENT_COLUMNS, MEASUREMENT_REQUIRED);
  const errors = [...table.errors];
  if (table.columns.length === 0 || errors.some((e) => e.row === 1)) return { plans: [], errors, rowCount: table.rows.length };

  const suits = (await db.select().from(suitConfigs)).map((r) => suitConfigSchema.parse(r.config));
  const members = await db.select({ id: crewMembers.id, key: sql<string>`lower(trim(${crewMembers.name}))` }).from(crewMembers);
  const idsByName = new Map<string, string[]>();
  for (const m of members) idsByName.set(m.key, [...(idsByName.get(m.key) ?? []), m.id]);

  const plans: MeasurementPlan[] = [];
  const namesInFile = new Map<string, number>();
  for (const r of table.rows) {
    const rowErrors: UploadRowError[] = [];
    const plan = planRow(r, suits, idsByName, namesInFile, rowErrors);
    errors.push(...rowErrors);
    if (plan && rowErrors.length === 0) plans.push(plan);
  }
  return { plans, errors, rowCount: table.rows.length };
}

function planRow(
  r: CsvRow,
  suits: SuitConfig[],
  idsByName: Map<string, string[]>,
  namesInFile: Map<string, number>,
  errors: UploadRowError[],
): MeasurementPlan | null {
  const c = r.cells;
  for (const col of MEASUREMENT_REQUIRED) if (!c[col]) errors.push({ row: r.row, column: col, reason: 'required value is empty' });

  const name = c.name ?? '';
  if (name.length > 120) errors.push({ row: r.row, column: 'name', reason: 'use at most 120 characters' });
  const key = name.toLowerCase();
  if (name && namesInFile.has(key)) errors.push({ row: r.row, column: 'name', reason: `"${name}" already appears on row ${namesInFile.get(key)}` });
  if (name) namesInFile.set(key, r.row);
  const existing = idsByName.get(key) ?? [];
  if (existing.length > 1) errors.push({ row: r.row, column: 'name', reason: `${existing.length} crew members are called "${name}"; rename one so the row is unambiguous` });

  const sex = c.sex?.toLowerCase();
  if (c.sex && sex !== 'female' && sex !== 'male') errors.push({ row: r.row, column: 'sex', reason: `"${c.sex}" is not female or male` });
  const stature = numberCell(r, 'stature_m', errors);
  const mass = numberCell(r, 'mass_kg', errors);
  const biacromialBreadth = numberCell(r, 'biacromial_m', errors);
  const hipBreadth = numberCell(r, 'hip_breadth_m', errors);
  const lengths: SegmentLengths = {};
  for (const [col, k] of Object.entries(MEASUREMENT_LENGTH_COLUMNS)) {
    const v = numberCell(r, col, errors);
    if (v !== undefined) lengths[k] = v;
  }
  let suit: SuitConfig | null = null;
  if (c.suit) {
    const wanted = c.suit.toLowerCase();
    suit = suits.find((s) => s.id === wanted || s.name.toLowerCase() === wanted) ?? null;
    if (!suit) errors.push({ row: r.row, column: 'suit', reason: `no suit "${c.suit}"; use one of: ${suits.map((s) => s.id).join(', ') || '(none stored)'}, or leave empty` });
  }
  // every range check of every field, not only the first: the schema lists all its issues at once
  const candidate = { sex: sex === 'female' || sex === 'male' ? sex : 'female', stature: stature ?? 1.75, mass: mass ?? 70, lengths, biacromialBreadth, hipBreadth, gear: [] };
  const checked = profileInputsSchema.safeParse(candidate);
  if (!checked.success) {
    for (const issue of checked.error.issues) {
      const column = columnFor(issue.path.join('.'));
      // a cell already reported (empty, not a number) or filled in above with a placeholder is not checked twice
      if (errors.some((e) => e.column === column)) continue;
      errors.push({ row: r.row, column, reason: issue.message });
    }
  }
  if (errors.length) return null;

  let profile: DerivedProfile;
  try {
    profile = deriveProfile({ sex: sex as 'female' | 'male', stature: stature!, mass: mass!, lengths, biacromialBreadth, hipBreadth, gear: [] }, suit, name);
  } catch (err) {
    if (err instanceof HttpError && err.field) {
      errors.push({ row: r.row, column: columnFor(err.field), reason: err.message.replace(/^[\w.]+: /, '') });
      return null;
    }
    throw err;
  }
  return { row: r.row, name, callSign: c.call_sign ?? '', note: c.note ?? '', existingMemberId: existing[0] ?? null, profile, cells: c };
}
