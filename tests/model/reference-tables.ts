import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import Papa from 'papaparse';

/** The project's verbatim copies of the shared reference tables (../shared/data/). */
const DATA = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../server/model/data');

function readCsv(file: string): Record<string, string>[] {
  // the files start with '#' source lines, then a header row
  const text = readFileSync(path.join(DATA, file), 'utf8')
    .split('\n')
    .filter((line) => !line.startsWith('#') && line.trim() !== '')
    .join('\n');
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
  if (parsed.errors.length) throw new Error(`${file}: ${parsed.errors[0].message}`);
  return parsed.data;
}

/** One row of de Leva (1996) Table 4 as transcribed, numbers parsed. */
export interface TableRow {
  sex: 'female' | 'male';
  segment: string;
  mass: number;
  com: number;
  rg_sag: number;
  rg_trans: number;
  rg_long: number;
  length_m: number;
}

/** de Leva P. (1996) J. Biomech. 29(9):1223-1230, Table 4 (the shared transcription). */
export function deLevaRows(): TableRow[] {
  return readCsv('de-leva-1996-table4.csv').map((r) => ({
    sex: r.sex as TableRow['sex'],
    segment: r.segment,
    mass: Number(r.mass),
    com: Number(r.com),
    rg_sag: Number(r.rg_sag),
    rg_trans: Number(r.rg_trans),
    rg_long: Number(r.rg_long),
    length_m: Number(r.length_m),
  }));
}

/** One de Leva row by sex and segment. */
export function deLevaRow(sex: 'female' | 'male', segment: string): TableRow {
  const row = deLevaRows().find((r) => r.sex === sex && r.segment === segment);
  if (!row) throw new Error(`no de Leva row ${sex}/${segment}`);
  return row;
}

/** Unsuited ranges of motion (AAOS via Norkin & White Table A.1; Merck Manual ROM table), degrees. */
export function jointRangeRows(): { joint: string; motion: string; range_deg: number }[] {
  return readCsv('joint-ranges-unsuited.csv').map((r) => ({ joint: r.joint, motion: r.motion, range_deg: Number(r.range_deg) }));
}
