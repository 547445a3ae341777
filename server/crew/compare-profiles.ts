import type { SegmentLengthKey } from '../../shared/contracts/profile-inputs.ts';
import type { ComparisonRow, ProfileComparison, ProfileVersionView } from '../../shared/contracts/profile-version.ts';
import { isSegmentName, SEGMENT_LABELS } from '../../shared/model/segment-names.ts';

/** Relative tolerance under which two derived numbers count as equal (float noise of re-derivation). */
const RELATIVE_TOLERANCE = 1e-9;
/**
 * Absolute floor of that tolerance, for values that are zero in exact arithmetic (a symmetric body's
 * lateral CoM comes out as ±1e-18 m): 1e-12 in SI units is far below any measurable change.
 */
const ABSOLUTE_TOLERANCE = 1e-12;

type Value = string | number | null;

function differs(a: Value, b: Value): boolean {
  if (typeof a === 'number' && typeof b === 'number') {
    return Math.abs(a - b) > Math.max(RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b)), ABSOLUTE_TOLERANCE);
  }
  return a !== b;
}

function row(key: string, label: string, unit: string, a: Value, b: Value): ComparisonRow {
  return { key, label, unit, a, b, changed: differs(a, b) };
}

const LENGTH_LABELS: Record<SegmentLengthKey, string> = {
  head: 'Head length', upperTrunk: 'Upper trunk length', middleTrunk: 'Middle trunk length', lowerTrunk: 'Lower trunk length',
  upperArm: 'Upper arm length', forearm: 'Forearm length', hand: 'Hand length', thigh: 'Thigh length', shank: 'Shank length',
  foot: 'Foot length', ankleHeight: 'Ankle height',
};

/** Inputs flattened into comparable lines; lines present in either version are listed. */
function inputRows(a: ProfileVersionView, b: ProfileVersionView): ComparisonRow[] {
  const ia = a.inputs;
  const ib = b.inputs;
  const rows: ComparisonRow[] = [
    row('source', 'Source', '', a.source, b.source),
    row('inputs.sex', 'Sex (regression table)', '', ia.sex ?? null, ib.sex ?? null),
    row('inputs.stature', 'Stature', 'm', ia.stature ?? null, ib.stature ?? null),
    row('inputs.mass', 'Body mass', 'kg', ia.mass ?? null, ib.mass ?? null),
    row('inputs.biacromialBreadth', 'Biacromial breadth', 'm', ia.biacromialBreadth ?? null, ib.biacromialBreadth ?? null),
    row('inputs.hipBreadth', 'Hip joint spacing', 'm', ia.hipBreadth ?? null, ib.hipBreadth ?? null),
  ];
  const lengthKeys = new Set([...Object.keys(ia.lengths ?? {}), ...Object.keys(ib.lengths ?? {})]);
  for (const k of (Object.keys(LENGTH_LABELS) as SegmentLengthKey[]).filter((key) => lengthKeys.has(key))) {
    const la = ia.lengths?.[k] ?? null;
    const lb = ib.lengths?.[k] ?? null;
    rows.push(row(`inputs.lengths.${k}`, `${LENGTH_LABELS[k]} (measured)`, 'm', la, lb));
  }
  rows.push(row('inputs.suit', 'Suit', '', ia.suit?.name ?? null, ib.suit?.name ?? null));
  // The suit's content may have been edited between versions even under the same name.
  rows.push(row('inputs.suit.content', 'Suit configuration (content)', '', ia.suit ? JSON.stringify(ia.suit) : null, ib.suit ? JSON.stringify(ib.suit) : null));
  const gear = (g: ProfileVersionView['inputs']['gear']) =>
    g?.length ? g.map((x) => `${x.name} ${x.mass} kg on ${x.segment}`).join('; ') : null;
  rows.push(row('inputs.gear', 'Gear', '', gear(ia.gear), gear(ib.gear)));
  rows.push(row('inputs.measuredTable', 'Measured segment table', '', ia.measuredTable?.fileName ?? null, ib.measuredTable?.fileName ?? null));
  // Leave out lines empty in both versions, except the core measurements.
  return rows.filter((r) => r.a !== null || r.b !== null || r.key === 'inputs.suit');
}

const AXES = ['x', 'y', 'z'] as const;

function wholeBodyRows(a: ProfileVersionView, b: ProfileVersionView): ComparisonRow[] {
  const sa = a.summary;
  const sb = b.summary;
  return [
    row('whole.mass', 'Whole-body mass', 'kg', sa.mass, sb.mass),
    ...AXES.map((ax, k) => row(`whole.com.${ax}`, `Whole-body CoM ${ax}`, 'm', sa.com[k], sb.com[k])),
    ...[0, 1, 2].map((k) => row(`whole.I${k + 1}`, `Principal moment I${k + 1}`, 'kg·m²', sa.principalMoments[k], sb.principalMoments[k])),
  ];
}

function segmentRows(a: ProfileVersionView, b: ProfileVersionView): ComparisonRow[] {
  const names = [...new Set([...a.summary.segments.map((s) => s.name), ...b.summary.segments.map((s) => s.name)])];
  const rows: ComparisonRow[] = [];
  for (const name of names) {
    const sa = a.summary.segments.find((s) => s.name === name);
    const sb = b.summary.segments.find((s) => s.name === name);
    const label = isSegmentName(name) ? SEGMENT_LABELS[name] : name;
    rows.push(row(`segments.${name}.mass`, `${label}: mass`, 'kg', sa?.mass ?? null, sb?.mass ?? null));
    AXES.forEach((ax, k) => rows.push(row(`segments.${name}.com.${ax}`, `${label}: CoM ${ax}`, 'm', sa?.com[k] ?? null, sb?.com[k] ?? null)));
    [0, 1, 2].forEach((k) =>
      rows.push(row(`segments.${name}.I${k + 1}`, `${label}: principal moment I${k + 1}`, 'kg·m²', sa?.principalMoments[k] ?? null, sb?.principalMoments[k] ?? null)),
    );
  }
  return rows;
}

/** Two versions side by side: inputs, whole-body values and every segment's values, with changed flags. */
export function compareProfiles(a: ProfileVersionView, b: ProfileVersionView): ProfileComparison {
  const strip = ({ inputs: _i, body: _b, summary: _s, ...header }: ProfileVersionView) => header;
  const inputs = inputRows(a, b);
  const wholeBody = wholeBodyRows(a, b);
  const segments = segmentRows(a, b);
  const changedCount = [...inputs, ...wholeBody, ...segments].filter((r) => r.changed).length;
  return { a: strip(a), b: strip(b), inputs, wholeBody, segments, changedCount };
}
