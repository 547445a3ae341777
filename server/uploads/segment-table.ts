import { type Body, validateBody } from '../../shared/contracts/body.ts';
import { SEGMENT_TABLE_COLUMNS, type UploadRowError } from '../../shared/contracts/uploads.ts';
import { numberCell, readCsvTable } from './csv-table.ts';

/** A measured body read from an upload, or the problems found. */
export interface MeasuredBody {
  body: Body | null;
  /** Segments whose mass properties came from the file. */
  segments: string[];
  errors: UploadRowError[];
  /** Parsed rows for upload_rows (row number and data). */
  rows: { row: number; data: Record<string, unknown> }[];
}

const REQUIRED = ['segment', 'mass_kg', 'com_x_m', 'com_y_m', 'com_z_m', 'ixx_kgm2', 'iyy_kgm2', 'izz_kgm2'] as const;

/**
 * A measured segment table CSV applied to the member's current body: each row replaces one
 * segment's mass, CoM and inertia; the joints (origins, axes, ranges) and unlisted segments stay as
 * they are. The result is checked against the body contract; a problem is reported on the row of
 * the segment at fault.
 */
export function measuredBodyFromCsv(text: string, current: Body): MeasuredBody {
  const table = readCsvTable(text, SEGMENT_TABLE_COLUMNS, REQUIRED);
  const errors = [...table.errors];
  const rows = table.rows.map((r) => ({ row: r.row, data: r.cells }));
  if (errors.some((e) => e.row <= 1)) return { body: null, segments: [], errors, rows };

  const segments = current.segments.map((s) => ({ ...s }));
  const rowOfSegment = new Map<string, number>();
  for (const r of table.rows) {
    const name = r.cells.segment;
    const i = segments.findIndex((s) => s.name === name);
    if (!name) errors.push({ row: r.row, column: 'segment', reason: 'required value is empty' });
    else if (i < 0) errors.push({ row: r.row, column: 'segment', reason: `"${name}" is not a segment of this body; the segments are: ${segments.map((s) => s.name).join(', ')}` });
    else if (rowOfSegment.has(name)) errors.push({ row: r.row, column: 'segment', reason: `"${name}" already appears on row ${rowOfSegment.get(name)}` });
    const before = errors.length;
    const n = (col: (typeof SEGMENT_TABLE_COLUMNS)[number], required: boolean) => {
      const v = numberCell(r, col, errors);
      if (v === undefined && required && r.cells[col] === '') errors.push({ row: r.row, column: col, reason: 'required value is empty' });
      return v ?? 0;
    };
    const mass = n('mass_kg', true);
    const com: [number, number, number] = [n('com_x_m', true), n('com_y_m', true), n('com_z_m', true)];
    const inertia: [number, number, number, number, number, number] = [
      n('ixx_kgm2', true), n('iyy_kgm2', true), n('izz_kgm2', true), n('ixy_kgm2', false), n('ixz_kgm2', false), n('iyz_kgm2', false),
    ];
    if (i < 0 || !name || rowOfSegment.has(name)) continue;
    rowOfSegment.set(name, r.row);
    if (errors.length > before) continue;
    segments[i] = { ...segments[i], mass, com, inertia: inertia.slice(3).every((x) => x === 0) ? [inertia[0], inertia[1], inertia[2]] : inertia };
  }
  if (errors.length) return { body: null, segments: [], errors, rows };

  const checked = validateBody({ ...current, segments });
  if (!checked.ok) {
    for (const issue of checked.issues) {
      const m = /^segments\[(\d+)\]\.?(\w*)/.exec(issue.path);
      const seg = m ? segments[Number(m[1])]?.name : undefined;
      const field = m?.[2] ?? '';
      const column = field === 'mass' ? 'mass_kg' : field === 'inertia' ? 'ixx_kgm2…iyz_kgm2' : field === 'com' ? 'com_x_m…com_z_m' : field;
      errors.push({ row: seg ? (rowOfSegment.get(seg) ?? 0) : 0, column, reason: issue.message });
    }
    return { body: null, segments: [], errors, rows };
  }
  return { body: checked.value, segments: [...rowOfSegment.keys()], errors: [], rows };
}

/**
 * A measured body as contract JSON: replaces the whole derived body. Problems are reported with
 * row 0 and the JSON path as the column.
 */
export function measuredBodyFromJson(text: string): MeasuredBody {
  let json: unknown;
  try {
    json = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (err) {
    return { body: null, segments: [], rows: [], errors: [{ row: 0, column: '', reason: `the file is not valid JSON: ${(err as Error).message}` }] };
  }
  const checked = validateBody(json);
  if (!checked.ok) return { body: null, segments: [], rows: [], errors: checked.issues.map((i) => ({ row: 0, column: i.path, reason: i.message })) };
  const body = checked.value;
  return {
    body,
    segments: body.segments.map((s) => s.name),
    errors: [],
    rows: body.segments.map((s, k) => ({ row: k + 1, data: s })),
  };
}
