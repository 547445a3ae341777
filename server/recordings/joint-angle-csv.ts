/**
 * Joint-angle CSV: a `time_s` column plus one column per standard-model dof (degrees). Times may be
 * uniform or not; the track is resampled to a uniform rate through each column's natural cubic
 * spline (the same spline the engine follows). Every problem is named by row and column.
 */
import { TRACK_LIMITS } from '../../shared/contracts/sequence.ts';
import type { UploadRowError } from '../../shared/contracts/uploads.ts';
import { MIN_SPLINE_POINTS, naturalCubicSpline, resampleUniform } from '../../shared/math/natural-cubic-spline.ts';
import { DOF_NAMES } from '../../shared/model/dof-names.ts';
import { type CsvRow, numberCell, readCsvTable } from '../uploads/csv-table.ts';

/** A gap: an interval this many times the median interval or more is reported (common practice for dropped samples). */
export const GAP_FACTOR = 3;
/** Relative spread of intervals below which times count as uniform. */
const UNIFORM_TOLERANCE = 1e-6;

/** A read joint-angle CSV. */
export interface JointAngleTable {
  errors: UploadRowError[];
  rows: CsvRow[];
  dofs: string[];
  rateHz: number;
  frames: number[][];
  assumptions: string[];
}

/** Reads and resamples a joint-angle CSV; `rateHz` overrides the rate (default: the file's, rounded to 0.001 Hz). */
export function readJointAngleCsv(text: string, rateHz?: number): JointAngleTable {
  const known = ['time_s', ...DOF_NAMES];
  const table = readCsvTable(text, known, ['time_s']);
  const errors = [...table.errors];
  const dofs = table.columns.filter((c) => c !== 'time_s' && (DOF_NAMES as readonly string[]).includes(c));
  const empty = { errors, rows: table.rows, dofs, rateHz: 0, frames: [], assumptions: [] };
  if (table.columns.length && dofs.length === 0) errors.push({ row: 1, column: '', reason: `no dof column; add one or more of: ${DOF_NAMES.join(', ')}` });
  if (errors.length && table.columns.length === 0) return empty;

  // Every cell a number; times strictly increasing.
  const times: number[] = [];
  const values: number[][] = dofs.map(() => []);
  let prevT = -Infinity;
  for (const r of table.rows) {
    const t = numberCell(r, 'time_s', errors);
    if (r.cells.time_s === '') errors.push({ row: r.row, column: 'time_s', reason: 'missing time' });
    if (t !== undefined) {
      if (t <= prevT) errors.push({ row: r.row, column: 'time_s', reason: `time ${t} s is not after the previous row's ${prevT} s (times must increase)` });
      prevT = Math.max(prevT, t);
    }
    times.push(t ?? NaN);
    dofs.forEach((d, j) => {
      const v = numberCell(r, d, errors);
      if (r.cells[d] === '') errors.push({ row: r.row, column: d, reason: 'missing value (a gap in the recording)' });
      else if (v !== undefined && Math.abs(v) > 3600) errors.push({ row: r.row, column: d, reason: `${v}° is beyond ±3600°` });
      values[j].push(v ?? NaN);
    });
  }
  if (table.rows.length && table.rows.length < MIN_SPLINE_POINTS) {
    errors.push({ row: 0, column: '', reason: `the recording has ${table.rows.length} rows; at least ${MIN_SPLINE_POINTS} are needed` });
  }
  if (errors.length) return empty;

  // Gaps: an interval much longer than the median one.
  const dts = times.slice(1).map((t, k) => t - times[k]);
  const median = [...dts].sort((a, b) => a - b)[Math.floor(dts.length / 2)];
  dts.forEach((dt, k) => {
    if (dt >= GAP_FACTOR * median) {
      errors.push({ row: table.rows[k + 1].row, column: 'time_s', reason: `a gap of ${dt.toPrecision(4)} s since the previous row (the usual interval is ${median.toPrecision(4)} s); fill or cut the recording there` });
    }
  });
  const fileRate = 1 / median;
  const rate = rateHz ?? Math.round(fileRate * 1000) / 1000;
  if (rate < TRACK_LIMITS.minRateHz || rate > TRACK_LIMITS.maxRateHz) {
    errors.push({ row: 0, column: 'time_s', reason: `the rate ${rate} Hz is outside ${TRACK_LIMITS.minRateHz}–${TRACK_LIMITS.maxRateHz} Hz` });
  }
  if (errors.length) return empty;

  // Resample each column's spline from the first time at the uniform rate.
  const spread = Math.max(...dts.map((d) => Math.abs(d - median))) / median;
  const uniform = spread < UNIFORM_TOLERANCE && Math.abs(rate - fileRate) / fileRate < UNIFORM_TOLERANCE;
  const cols = values.map((ys) => (uniform ? ys : resampleUniform(naturalCubicSpline(times, ys), rate)));
  const frames = cols[0].map((_, k) => cols.map((c) => c[k]));
  if (frames.length < MIN_SPLINE_POINTS) {
    return { ...empty, errors: [{ row: 0, column: 'time_s', reason: `resampled at ${rate} Hz the recording has only ${frames.length} frames; at least ${MIN_SPLINE_POINTS} are needed` }] };
  }
  const assumptions = [
    uniform
      ? `Times are uniform at ${rate} Hz: frames kept as recorded.`
      : `Times are ${spread < UNIFORM_TOLERANCE ? 'uniform' : 'not uniform'} (median interval ${median.toPrecision(4)} s); resampled at ${rate} Hz through each column's natural cubic spline.`,
    `The first row's time (${times[0]} s) becomes the track's start.`,
  ];
  return { errors, rows: table.rows, dofs, rateHz: rate, frames, assumptions };
}
