import Papa from 'papaparse';

import type { UploadRowError } from '../../shared/contracts/uploads.ts';

/** One data row of a CSV: its number in the file (header = 1) and its cells by column name. */
export interface CsvRow {
  row: number;
  cells: Record<string, string>;
}

/** A parsed CSV: the data rows, or the problems that stop reading it at all. */
export interface CsvTable {
  columns: string[];
  rows: CsvRow[];
  errors: UploadRowError[];
}

/**
 * Reads a CSV with a header row into trimmed cells keyed by lower-case column name. Checks the
 * header against the documented columns (unknown, duplicate or missing required columns are errors
 * on row 1) and each row's cell count. Entirely empty lines are skipped. Rows are numbered as
 * records in the file, header = 1 (the line number unless a quoted cell spans lines).
 */
export function readCsvTable(text: string, known: readonly string[], required: readonly string[]): CsvTable {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { header: false, skipEmptyLines: false, delimiter: ',' });
  const errors: UploadRowError[] = [];
  for (const e of parsed.errors) {
    // Papaparse's row index counts records from 0 (the header).
    errors.push({ row: (e.row ?? -1) + 1, column: '', reason: `the CSV cannot be read here: ${e.message}` });
  }
  const records = parsed.data;
  const header = (records[0] ?? []).map((h) => h.trim().toLowerCase());
  if (header.length === 0 || header.every((h) => h === '')) {
    return { columns: [], rows: [], errors: [{ row: 1, column: '', reason: `the file has no header row; the first line must name the columns: ${known.join(',')}` }] };
  }
  const seen = new Set<string>();
  header.forEach((h, i) => {
    if (h === '') errors.push({ row: 1, column: `column ${i + 1}`, reason: 'empty column name in the header' });
    else if (!known.includes(h)) errors.push({ row: 1, column: h, reason: `unknown column; the columns are: ${known.join(', ')}` });
    else if (seen.has(h)) errors.push({ row: 1, column: h, reason: 'this column appears twice in the header' });
    seen.add(h);
  });
  for (const r of required) if (!seen.has(r)) errors.push({ row: 1, column: r, reason: 'required column is missing from the header' });

  const rows: CsvRow[] = [];
  records.slice(1).forEach((cells, i) => {
    const row = i + 2;
    if (cells.every((c) => c.trim() === '')) return;
    if (cells.length !== header.length) {
      errors.push({ row, column: '', reason: `this row has ${cells.length} cells but the header has ${header.length} columns` });
      return;
    }
    const byName: Record<string, string> = {};
    header.forEach((h, k) => (byName[h] = cells[k].trim()));
    rows.push({ row, cells: byName });
  });
  if (rows.length === 0 && errors.length === 0) errors.push({ row: 0, column: '', reason: 'the file has a header but no data rows' });
  return { columns: header, rows, errors };
}

/**
 * A numeric cell: undefined when empty, else a finite number, or an error naming row and column.
 * Decimal point only ("1.75"), no thousands separators.
 */
export function numberCell(r: CsvRow, column: string, errors: UploadRowError[]): number | undefined {
  const text = r.cells[column];
  if (text === undefined || text === '') return undefined;
  const value = Number(text);
  if (!Number.isFinite(value) || !/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(text)) {
    errors.push({ row: r.row, column, reason: `"${text}" is not a number (use a decimal point, e.g. 1.75)` });
    return undefined;
  }
  return value;
}
