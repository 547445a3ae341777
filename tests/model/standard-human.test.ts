import { describe, expect, it } from 'vitest';

import { deriveBody, type DerivedBody, type DerivedSegment, ProfileInputError } from '../../server/model/derive-body.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { createBodyPose, forwardKinematics } from '../../shared/kinematics/forward-kinematics.ts';
import { symmetricEigen3 } from '../../shared/math/symmetric-eigen.ts';
import { SEGMENT_NAMES } from '../../shared/model/segment-names.ts';
import { PEOPLE, who } from './people.ts';
import { deLevaRow } from './reference-tables.ts';

// Outside reference: de Leva P. (1996) Adjustments to Zatsiorsky-Seluyanov's segment inertia
// parameters, J. Biomech. 29(9):1223-1230, Table 4 (shared transcription, read from CSV here).

/** Carrying angle of the model's forearm and hand (server/model/proportions.ts; anatomy texts, from memory). */
const CARRYING = { male: 11, female: 14 } as const;

/** Mean statures of de Leva's reference samples (the transcription's header): lengths scale from them. */
const REF_STATURE = { male: 1.741, female: 1.735 } as const;

const seg = (body: DerivedBody, name: string): DerivedSegment => {
  const s = body.segments.find((x) => x.name === name);
  if (!s) throw new Error(`no segment ${name}`);
  return s;
};

describe('standard human model reproduces de Leva (1996) Table 4', () => {
  it('a woman entered at 58 kg weighs 58 kg to 1e-9 relative (the published female fractions alone give 57.9942 kg)', () => {
    const { body } = deriveBody({ sex: 'female', stature: 1.65, mass: 58 });
    const total = body.segments.reduce((s, x) => s + x.mass, 0);
    expect(Math.abs(total / 58 - 1)).toBeLessThanOrEqual(1e-9);
  });

  for (const person of PEOPLE) {
    const { sex, stature, mass } = person;
    const { body } = deriveBody(person);
    const L = (segment: string) => (deLevaRow(sex, segment).length_m * stature) / REF_STATURE[sex];
    const tableSum = ['head', 'upper_trunk', 'middle_trunk', 'lower_trunk']
      .concat(['upper_arm', 'forearm', 'hand', 'thigh', 'shank', 'foot'].flatMap((s) => [s, s]))
      .reduce((sum, s) => sum + deLevaRow(sex, s).mass, 0);

    it(`${who(person)}: 15 segments in contract order, upper_trunk the root`, () => {
      expect(body.segments.map((s) => s.name)).toEqual([...SEGMENT_NAMES]);
      expect(body.segments.filter((s) => s.parent === undefined).map((s) => s.name)).toEqual(['upper_trunk']);
    });

    it(`${who(person)}: segment mass fractions equal the table's, normalised by their sum (upper trunk = upper + middle trunk rows)`, () => {
      // the published fractions (four places) sum to 1.0000 (men) and 0.9999 (women): the model divides
      // each by that sum, so ratios between segments stay exactly the table's
      const fraction = (name: string) => (seg(body, name).mass / mass) * tableSum;
      expect(fraction('head_neck')).toBeCloseTo(deLevaRow(sex, 'head').mass, 12);
      expect(fraction('upper_trunk')).toBeCloseTo(deLevaRow(sex, 'upper_trunk').mass + deLevaRow(sex, 'middle_trunk').mass, 12);
      expect(fraction('lower_trunk')).toBeCloseTo(deLevaRow(sex, 'lower_trunk').mass, 12);
      for (const side of ['l', 'r'])
        for (const part of ['upper_arm', 'forearm', 'hand', 'thigh', 'shank', 'foot'])
          expect(fraction(`${side}_${part}`), `${side}_${part}`).toBeCloseTo(deLevaRow(sex, part).mass, 12);
    });

    it(`${who(person)}: total mass equals the entered body mass to 1e-9 relative`, () => {
      const total = body.segments.reduce((s, x) => s + x.mass, 0);
      expect(Math.abs(total / mass - 1)).toBeLessThanOrEqual(1e-9);
    });

    it(`${who(person)}: limb CoM ratios and lengths (stature-scaled) equal the table's`, () => {
      const chain: [string, string, string | null][] = [
        ['upper_arm', 'upper_arm', 'forearm'],
        ['forearm', 'forearm', 'hand'],
        ['hand', 'hand', null],
        ['thigh', 'thigh', 'shank'],
        ['shank', 'shank', 'foot'],
      ];
      for (const side of ['l', 'r'])
        for (const [name, table, child] of chain) {
          const s = seg(body, `${side}_${name}`);
          // CoM on the long axis at the table's fraction of length from the proximal joint; the long
          // axis is −z, turned outward by the carrying angle for forearm and hand
          const slant = ((name === 'forearm' || name === 'hand' ? CARRYING[sex] : 0) * Math.PI) / 180;
          const out = side === 'l' ? 1 : -1;
          const along = (d: number) => [0, out * Math.sin(slant) * d, -Math.cos(slant) * d];
          expect(s.com[0]).toBe(0);
          expect(Math.hypot(...s.com) / L(table)).toBeCloseTo(deLevaRow(sex, table).com, 12);
          along(deLevaRow(sex, table).com * L(table)).forEach((v, k) => expect(s.com[k] + 0).toBeCloseTo(v, 12));
          // the distal joint sits one segment length down the long axis
          if (child) along(L(table)).forEach((v, k) => expect(seg(body, `${side}_${child}`).joint!.origin[k] + 0).toBeCloseTo(v, 12));
        }
      const pelvis = seg(body, 'lower_trunk');
      expect(-pelvis.com[2] / L('lower_trunk')).toBeCloseTo(deLevaRow(sex, 'lower_trunk').com, 12);
      expect(seg(body, 'l_thigh').joint?.origin[2]).toBeCloseTo(-L('lower_trunk'), 12);
    });

    it(`${who(person)}: radii of gyration — rg_sag about x, rg_trans about y, rg_long about the long axis`, () => {
      const check = (name: string, table: string, longAxis: 'x' | 'z') => {
        const s = seg(body, name);
        const r = deLevaRow(sex, table);
        const expected = longAxis === 'z' ? [r.rg_sag, r.rg_trans, r.rg_long] : [r.rg_long, r.rg_trans, r.rg_sag];
        if (/forearm|hand/.test(name)) {
          // turned by the carrying angle: the principal moments are the table's
          const [a, b, c, xy, xz, yz] = s.inertia.length === 6 ? s.inertia : [...s.inertia, 0, 0, 0];
          const moments = symmetricEigen3([a, xy, xz, xy, b, yz, xz, yz, c]).values.map((I) => Math.sqrt(I / s.mass) / L(table));
          [...expected].sort((u, v) => u - v).forEach((v, i) => expect(moments[i], `${name}[${i}]`).toBeCloseTo(v, 10));
          return;
        }
        const k = s.inertia.map((I) => Math.sqrt(I / s.mass) / L(table));
        expect(s.inertia).toHaveLength(3);
        k.forEach((v, i) => expect(v, `${name}[${i}]`).toBeCloseTo(expected[i], 12));
      };
      check('head_neck', 'head', 'z');
      check('lower_trunk', 'lower_trunk', 'z');
      for (const side of ['l', 'r']) {
        for (const part of ['upper_arm', 'forearm', 'hand', 'thigh', 'shank']) check(`${side}_${part}`, part, 'z');
        check(`${side}_foot`, 'foot', 'x');
      }
    });

    it(`${who(person)}: upper trunk = table's upper and middle trunk combined by the parallel-axis theorem`, () => {
      const u = deLevaRow(sex, 'upper_trunk');
      const m = deLevaRow(sex, 'middle_trunk');
      const [mu, mm] = [(u.mass * mass) / tableSum, (m.mass * mass) / tableSum];
      // heights above the omphalion (the waist joint, the root frame's origin)
      const zu = L('middle_trunk') + L('upper_trunk') * (1 - u.com);
      const zm = L('middle_trunk') * (1 - m.com);
      const zc = (mu * zu + mm * zm) / (mu + mm);
      const shift = mu * (zu - zc) ** 2 + mm * (zm - zc) ** 2;
      const ut = seg(body, 'upper_trunk');
      expect(ut.com[2]).toBeCloseTo(zc, 12);
      expect(ut.inertia[0]).toBeCloseTo(mu * (u.rg_sag * L('upper_trunk')) ** 2 + mm * (m.rg_sag * L('middle_trunk')) ** 2 + shift, 12);
      expect(ut.inertia[1]).toBeCloseTo(mu * (u.rg_trans * L('upper_trunk')) ** 2 + mm * (m.rg_trans * L('middle_trunk')) ** 2 + shift, 12);
      expect(ut.inertia[2]).toBeCloseTo(mu * (u.rg_long * L('upper_trunk')) ** 2 + mm * (m.rg_long * L('middle_trunk')) ** 2, 12);
    });

    it(`${who(person)}: the trunk's CoM from the three sub-segment rows lies within 1% of trunk length of the whole-trunk row's`, () => {
      // two regressions of the same table (sub-segments vs whole trunk) that should agree closely
      const ut = seg(body, 'upper_trunk');
      const lt = seg(body, 'lower_trunk');
      const zSupr = L('upper_trunk') + L('middle_trunk');
      const zCom = (ut.mass * ut.com[2] + lt.mass * lt.com[2]) / (ut.mass + lt.mass);
      const fromSupr = (zSupr - zCom) / L('trunk');
      expect(Math.abs(fromSupr - deLevaRow(sex, 'trunk').com)).toBeLessThan(0.01);
    });

    it(`${who(person)}: standing in the reference posture the body is exactly as tall as the stature`, () => {
      const d = deriveBody(person);
      const model = compileBody(d.body);
      const pose = createBodyPose(model);
      forwardKinematics(model, new Float64Array(model.dofCount), pose);
      const z = (name: string) => pose.pos[3 * model.segmentNames.indexOf(name) + 2];
      const sole = z('l_foot') - 0.039 * stature; // ankle height 0.039 H, Drillis & Contini via Winter (from memory)
      const vertex = z('head_neck') + d.geometry.supraToVertex;
      expect(vertex - sole).toBeCloseTo(stature, 12);
      // head CoM at the table's fraction of VERT–MIDG below the vertex
      expect((d.geometry.supraToVertex - seg(body, 'head_neck').com[2]) / L('head')).toBeCloseTo(deLevaRow(sex, 'head').com, 12);
    });
  }

  it('axis convention: the pelvis (wider than deep) has its larger moment about x, the anteroposterior axis', () => {
    // rg_sag > rg_trans for the lower trunk in both tables: with rg_sag about x, Ixx > Iyy
    for (const sex of ['male', 'female'] as const) {
      const pelvis = seg(deriveBody({ sex, stature: 1.7, mass: 70 }).body, 'lower_trunk');
      expect(pelvis.inertia[0]).toBeGreaterThan(pelvis.inertia[1]);
      expect(pelvis.inertia[0] / pelvis.inertia[1]).toBeCloseTo((deLevaRow(sex, 'lower_trunk').rg_sag / deLevaRow(sex, 'lower_trunk').rg_trans) ** 2, 12);
    }
  });

  it('a measured thigh length replaces the scaled one: knee placed and inertia scaled by it', () => {
    const { body } = deriveBody({ sex: 'male', stature: 1.75, mass: 75, lengths: { thigh: 0.46 } });
    const thigh = seg(body, 'r_thigh');
    expect(seg(body, 'r_shank').joint?.origin[2]).toBeCloseTo(-0.46, 12);
    expect(thigh.com[2]).toBeCloseTo(-deLevaRow('male', 'thigh').com * 0.46, 12);
    expect(thigh.inertia[0]).toBeCloseTo(thigh.mass * (deLevaRow('male', 'thigh').rg_sag * 0.46) ** 2, 12);
    // an unmeasured neighbour keeps its stature-scaled length
    expect(seg(body, 'r_foot').joint?.origin[2]).toBeCloseTo((-deLevaRow('male', 'shank').length_m * 1.75) / REF_STATURE.male, 12);
  });

  it('measured biacromial and hip breadths place the shoulders and hips at ± half of them', () => {
    const { body } = deriveBody({ sex: 'female', stature: 1.65, mass: 60, biacromialBreadth: 0.38, hipBreadth: 0.19 });
    expect(seg(body, 'l_upper_arm').joint?.origin[1]).toBeCloseTo(0.19, 12);
    expect(seg(body, 'r_upper_arm').joint?.origin[1]).toBeCloseTo(-0.19, 12);
    expect(seg(body, 'l_thigh').joint?.origin[1]).toBeCloseTo(0.095, 12);
    expect(seg(body, 'r_thigh').joint?.origin[1]).toBeCloseTo(-0.095, 12);
  });

  it('measured lengths longer than the stature allows are rejected, naming the field', () => {
    expect(() => deriveBody({ sex: 'male', stature: 1.6, mass: 70, lengths: { thigh: 0.6, shank: 0.6 } })).toThrow(
      expect.objectContaining({ name: 'ProfileInputError', field: 'lengths' }),
    );
  });

  it('bad inputs are rejected with the field named (stature, sex, a length, NaN mass)', () => {
    const field = (raw: unknown) => {
      try {
        deriveBody(raw as never);
      } catch (e) {
        if (e instanceof ProfileInputError) return e.field;
        throw e;
      }
      return null;
    };
    expect(field({ sex: 'male', stature: 0.5, mass: 70 })).toBe('stature');
    expect(field({ sex: 'other', stature: 1.7, mass: 70 })).toBe('sex');
    expect(field({ sex: 'male', stature: 1.7, mass: 70, lengths: { thigh: -0.4 } })).toBe('lengths.thigh');
    expect(field({ sex: 'male', stature: 1.7, mass: Number.NaN })).toBe('mass');
  });
});
