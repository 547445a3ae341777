import { describe, expect, it } from 'vitest';

import { deriveBody } from '../../server/model/derive-body.ts';
import { BUILT_IN_SUITS, findBuiltInSuit } from '../../server/model/suits/index.ts';
import { validateBody } from '../../shared/contracts/body.ts';
import { suitConfigSchema } from '../../shared/contracts/suit.ts';
import { wholeBodyInertia } from '../../shared/model/whole-body.ts';
import { PEOPLE, who } from './people.ts';

const totalMass = (body: { segments: { mass: number }[] }) => body.segments.reduce((s, x) => s + x.mass, 0);
const addedMass = (suit: (typeof BUILT_IN_SUITS)[number]) => Object.values(suit.segments).reduce((s, a) => s + (a?.mass ?? 0), 0);

describe('derived bodies pass the body contract validation', () => {
  for (const person of PEOPLE) {
    for (const suit of [null, ...BUILT_IN_SUITS]) {
      it(`${who(person)}, ${suit?.id ?? 'no suit'}`, () => {
        const result = validateBody(deriveBody({ ...person, suit }).body);
        expect(result.ok ? [] : result.issues).toEqual([]);
      });
    }
  }
  it('with gear carrying off-diagonal inertia (six-entry inertia lists)', () => {
    const { body } = deriveBody({
      sex: 'male', stature: 1.8, mass: 80,
      gear: [{ name: 'tool caddy', segment: 'lower_trunk', mass: 3, position: [0.1, -0.15, -0.05], inertia: [0.02, 0.03, 0.03] }],
    });
    expect(body.segments.find((s) => s.name === 'lower_trunk')!.inertia).toHaveLength(6);
    const result = validateBody(body);
    expect(result.ok ? [] : result.issues).toEqual([]);
  });
});

describe('suits', () => {
  it('every shipped suit is marked illustrative and says so in its note', () => {
    expect(BUILT_IN_SUITS.map((s) => s.id)).toEqual(['cabin-clothing', 'pressurised-suit']);
    for (const s of BUILT_IN_SUITS) {
      expect(s.illustrative).toBe(true);
      expect(s.note).toMatch(/illustrative/i);
    }
  });

  for (const suit of BUILT_IN_SUITS) {
    for (const person of PEOPLE.slice(0, 2)) {
      it(`${suit.id} on ${who(person)}: body mass rises by exactly the suit's added mass`, () => {
        const bare = totalMass(deriveBody(person).body);
        const suited = totalMass(deriveBody({ ...person, suit }).body);
        expect(suited - bare).toBeCloseTo(addedMass(suit), 10);
      });
    }
  }

  it('pressurised suit: suited ranges replace the unsuited ones and the locked dof disappears', () => {
    const suit = findBuiltInSuit('pressurised-suit')!;
    const { body } = deriveBody({ sex: 'male', stature: 1.75, mass: 75, suit });
    const dofs = body.segments.flatMap((s) => s.joint?.dofs ?? []);
    expect(dofs.map((d) => d.name)).not.toContain('waist_flex');
    for (const [name, range] of Object.entries(suit.ranges)) {
      expect(dofs.find((d) => d.name === name), name).toMatchObject(range);
    }
  });

  it('an added mass at the segment CoM leaves the CoM and adds its own inertia; an offset one obeys the parallel-axis theorem', () => {
    const base = deriveBody({ sex: 'female', stature: 1.6, mass: 55 }).body.segments.find((s) => s.name === 'head_neck')!;
    const suit = suitConfigSchema.parse({
      id: 'test-helmets', name: 'test', illustrative: true,
      segments: { head_neck: { mass: 4, inertia: [0.1, 0.1, 0.1] } },
    });
    const a = deriveBody({ sex: 'female', stature: 1.6, mass: 55, suit }).body.segments.find((s) => s.name === 'head_neck')!;
    a.com.forEach((v, k) => expect(v).toBeCloseTo(base.com[k], 14));
    a.inertia.forEach((v, k) => expect(v).toBeCloseTo(base.inertia[k] + 0.1, 12));
    // point mass m at offset d along x from the segment CoM: Steiner, reduced mass μ = m·M/(m+M)
    const m = 2;
    const dx = 0.2;
    const shifted = suitConfigSchema.parse({
      id: 'test-offset', name: 'test', illustrative: true,
      segments: { head_neck: { mass: m, com: [base.com[0] + dx, base.com[1], base.com[2]] } },
    });
    const b = deriveBody({ sex: 'female', stature: 1.6, mass: 55, suit: shifted }).body.segments.find((s) => s.name === 'head_neck')!;
    const mu = (m * base.mass) / (m + base.mass);
    expect(b.com[0]).toBeCloseTo((m * dx) / (m + base.mass), 12);
    expect(b.inertia[0]).toBeCloseTo(base.inertia[0], 12);
    expect(b.inertia[1]).toBeCloseTo(base.inertia[1] + mu * dx * dx, 12);
    expect(b.inertia[2]).toBeCloseTo(base.inertia[2] + mu * dx * dx, 12);
  });

  it('a suit naming a dof that is not in the body is rejected by the schema, naming the key', () => {
    const r = suitConfigSchema.safeParse({ id: 'x', name: 'x', illustrative: true, lockedDofs: ['neck_flex'] });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path).toEqual(['lockedDofs', 0]);
  });

  it('an added inertia breaking the triangle inequality is rejected', () => {
    const r = suitConfigSchema.safeParse({ id: 'x', name: 'x', illustrative: true, segments: { l_hand: { mass: 1, inertia: [0.01, 0.01, 0.05] } } });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path).toEqual(['segments', 'l_hand', 'inertia']);
  });
});

describe('gear', () => {
  it('a point mass on the hand raises whole-body mass by its mass and moves the system CoM by m·p/M_total', () => {
    const person = { sex: 'male', stature: 1.75, mass: 75 } as const;
    const bare = wholeBodyInertia(deriveBody(person).body);
    const item = { name: 'sample bag', segment: 'r_hand' as const, mass: 1.5, position: [0, 0, -0.1] as [number, number, number] };
    const { body } = deriveBody({ ...person, gear: [item] });
    const carried = wholeBodyInertia(body);
    expect(carried.mass - bare.mass).toBeCloseTo(1.5, 12);
    // the item hangs below the right hand: the system CoM moves right (−y) and down
    expect(carried.com[1]).toBeLessThan(0);
    // exact: new CoM = (M·c + m·p_item)/(M + m), p_item in the root frame from the hand's frame
    const hand = body.segments.find((s) => s.name === 'r_hand')!;
    const bareHand = deriveBody(person).body.segments.find((s) => s.name === 'r_hand')!;
    expect(hand.mass).toBeCloseTo(bareHand.mass + 1.5, 12);
    expect(hand.com[2]).toBeCloseTo((bareHand.mass * bareHand.com[2] + 1.5 * -0.1) / hand.mass, 12);
  });

  it('two items on one segment combine like one item of their total mass at their common CoM', () => {
    const person = { sex: 'female', stature: 1.62, mass: 58 } as const;
    const two = deriveBody({ ...person, gear: [
      { name: 'a', segment: 'l_thigh', mass: 1, position: [0.1, 0, -0.2] },
      { name: 'b', segment: 'l_thigh', mass: 1, position: [-0.1, 0, -0.2] },
    ] }).body.segments.find((s) => s.name === 'l_thigh')!;
    const one = deriveBody({ ...person, gear: [
      // two unit masses at ±0.1 m along x: about their CoM Iyy = Izz = 2·1·0.1² = 0.02
      { name: 'ab', segment: 'l_thigh', mass: 2, position: [0, 0, -0.2], inertia: [0, 0.02, 0.02] },
    ] }).body.segments.find((s) => s.name === 'l_thigh')!;
    expect(two.mass).toBeCloseTo(one.mass, 12);
    two.com.forEach((v, k) => expect(v).toBeCloseTo(one.com[k], 12));
    two.inertia.forEach((v, k) => expect(v).toBeCloseTo(one.inertia[k], 12));
  });
});
