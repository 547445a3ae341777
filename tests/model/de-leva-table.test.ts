import { describe, expect, it } from 'vitest';

import { DE_LEVA_REFERENCE_STATURE_M, DE_LEVA_TABLE_4 } from '../../server/model/data/de-leva-1996-table4.ts';
import { deLevaRows } from './reference-tables.ts';

// Source of every check here: de Leva P. (1996) J. Biomech. 29(9):1223-1230, Table 4, as transcribed
// in the shared reference table (copied verbatim into server/model/data/).

/** The table gives fractions to 4 decimals: 14 rounded entries may miss 1 by a few 1e-4. */
const TABLE_ROUNDING = 2e-4;

describe('de Leva (1996) Table 4 in the model', () => {
  it('every value of the model constant equals the shared transcription, both sexes', () => {
    const rows = deLevaRows();
    expect(rows).toHaveLength(22);
    for (const r of rows) {
      const m = DE_LEVA_TABLE_4[r.sex][r.segment as keyof (typeof DE_LEVA_TABLE_4)['male']];
      expect(m, `${r.sex}/${r.segment}`).toBeDefined();
      expect([m.mass, m.com, m.rgSag, m.rgTrans, m.rgLong, m.lengthM], `${r.sex}/${r.segment}`).toEqual([
        r.mass, r.com, r.rg_sag, r.rg_trans, r.rg_long, r.length_m,
      ]);
    }
  });

  for (const sex of ['male', 'female'] as const) {
    it(`${sex}: the 14-segment mass fractions sum to 1 within the table's rounding`, () => {
      const t = DE_LEVA_TABLE_4[sex];
      const limbs = t.upper_arm.mass + t.forearm.mass + t.hand.mass + t.thigh.mass + t.shank.mass + t.foot.mass;
      expect(Math.abs(t.head.mass + t.trunk.mass + 2 * limbs - 1)).toBeLessThanOrEqual(TABLE_ROUNDING);
    });

    it(`${sex}: upper, middle and lower trunk add up to the whole trunk in mass and length`, () => {
      const t = DE_LEVA_TABLE_4[sex];
      expect(t.upper_trunk.mass + t.middle_trunk.mass + t.lower_trunk.mass).toBeCloseTo(t.trunk.mass, 4);
      expect(t.upper_trunk.lengthM + t.middle_trunk.lengthM + t.lower_trunk.lengthM).toBeCloseTo(t.trunk.lengthM, 4);
    });
  }

  it('reference statures are those of the transcription header (male 1.741 m, female 1.735 m)', () => {
    expect(DE_LEVA_REFERENCE_STATURE_M).toEqual({ male: 1.741, female: 1.735 });
  });
});
