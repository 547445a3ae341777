/**
 * Bad bodies and sequences: each gets an issue naming the segment/step, the field and the reason.
 */
import { describe, expect, it } from 'vitest';

import { type Body, validateBody } from '../../shared/contracts/body.ts';
import { validateSequence } from '../../shared/contracts/sequence.ts';
import { loadBody } from './fixtures.ts';

const good = (): Body => structuredClone(loadBody('arm-on-trunk'));

/** Validates a body and returns its issues' messages and paths (fails the test if it is valid). */
function bodyIssues(json: unknown) {
  const r = validateBody(json);
  if (r.ok) throw new Error('expected the body to be rejected');
  return r.issues;
}

describe('body contract errors', () => {
  it('accepts the valid fixture', () => {
    expect(validateBody(good()).ok).toBe(true);
  });

  const cases: [string, (b: Body) => void, string, RegExp][] = [
    ['unknown parent', (b) => { b.segments[2].parent = 'r_upperarm'; }, 'segments[2].parent', /r_forearm.*unknown parent 'r_upperarm'/],
    ['two roots', (b) => { delete b.segments[2].parent; delete b.segments[2].joint; }, 'segments[2].parent', /r_forearm.*two roots/],
    ['parent listed after child', (b) => { b.segments = [b.segments[0], b.segments[2], b.segments[1]]; }, 'segments[1].parent', /r_forearm.*parent 'r_upper_arm' is listed after/],
    ['cycle between two children', (b) => { b.segments[1].parent = 'r_forearm'; }, 'segments[1].parent', /r_upper_arm.*cycle/],
    ['cycle', (b) => { b.segments[0].parent = 'r_forearm'; b.segments[0].joint = { origin: [0, 0, 0], dofs: [] }; }, 'segments[0].parent', /trunk.*cycle/],
    ['zero mass', (b) => { b.segments[1].mass = 0; }, 'segments[1].mass', /r_upper_arm.*mass must be positive/],
    ['negative mass', (b) => { b.segments[1].mass = -2; }, 'segments[1].mass', /r_upper_arm.*mass must be positive/],
    ['inertia not positive definite', (b) => { b.segments[0].inertia = [1, 1, -0.1]; }, 'segments[0].inertia', /trunk.*not positive definite/],
    ['inertia breaking the triangle inequality', (b) => { b.segments[0].inertia = [0.1, 0.1, 0.5]; }, 'segments[0].inertia', /trunk.*triangle inequality/],
    // Diagonal entries pass alone; the products of inertia push a principal moment negative.
    ['products of inertia making it indefinite', (b) => { b.segments[1].inertia = [0.015, 0.015, 0.002, 0.02, 0, 0]; }, 'segments[1].inertia', /r_upper_arm.*not positive definite/],
    ['zero axis', (b) => { b.segments[1].joint!.dofs[1].axis = [0, 0, 0]; }, 'segments[1].joint.dofs[1].axis', /r_upper_arm.*r_sh_abd.*zero axis/],
    ['duplicate segment name', (b) => { b.segments[2].name = 'r_upper_arm'; }, 'segments[2].name', /duplicate segment name 'r_upper_arm'/],
    ['duplicate dof name', (b) => { b.segments[2].joint!.dofs[0].name = 'r_sh_flex'; }, 'segments[2].joint.dofs[0].name', /r_forearm.*duplicate dof name 'r_sh_flex'/],
    ['NaN mass', (b) => { b.segments[1].mass = NaN; }, 'segments[1].mass', /r_upper_arm.*finite number/],
    ['Infinity in com', (b) => { b.segments[2].com[1] = Infinity; }, 'segments[2].com[1]', /r_forearm.*finite number/],
    ['min above max', (b) => { b.segments[2].joint!.dofs[0].min = 200; }, 'segments[2].joint.dofs[0].min', /r_elbow.*min 200° above max 150°/],
    ['missing joint on a child', (b) => { delete b.segments[2].joint; }, 'segments[2].joint', /r_forearm.*needs a joint/],
    ['wrong inertia length', (b) => { (b.segments[0] as { inertia: number[] }).inertia = [1, 1]; }, 'segments[0].inertia', /trunk.*\[Ixx, Iyy, Izz\]/],
  ];
  for (const [name, mutate, path, message] of cases) {
    it(`rejects ${name}, naming ${path}`, () => {
      const b = good();
      mutate(b);
      const issues = bodyIssues(b);
      const hit = issues.find((i) => i.path === path);
      expect(hit, JSON.stringify(issues)).toBeDefined();
      expect(hit!.message).toMatch(message);
    });
  }

  it('rejects non-object input without throwing', () => {
    expect(bodyIssues('nope')[0].message).toMatch(/expected object/i);
    expect(bodyIssues({ name: 'x', segments: [] })[0].path).toBe('segments');
  });
});

describe('sequence contract errors', () => {
  const body = good();
  const issuesOf = (json: unknown) => {
    const r = validateSequence(json, body);
    if (r.ok) throw new Error('expected the sequence to be rejected');
    return r.issues;
  };

  it('accepts a valid sequence and fills the start default', () => {
    const r = validateSequence({ steps: [{ kind: 'hold', duration: 1 }] }, body);
    expect(r.ok && r.value.start).toEqual({});
  });

  it('names the step index and dof when a harmonic does not start where the previous step ended', () => {
    const issues = issuesOf({ start: { r_sh_flex: 10 }, steps: [
      { kind: 'hold', duration: 1 },
      { kind: 'harmonic', period: 1, cycles: 1, joints: { r_sh_flex: { offset: 0, amplitude: 20, phase: 0 } } },
    ] });
    expect(issues[0].path).toBe('steps[1].joints.r_sh_flex');
    expect(issues[0].message).toMatch(/step 1 \(harmonic\): dof 'r_sh_flex' starts at 0° but the previous step ended at 10°/);
  });

  it('accepts a harmonic that starts within 1e-6° of the previous end', () => {
    expect(validateSequence({ start: { r_sh_flex: 10 + 5e-7 }, steps: [
      { kind: 'harmonic', period: 1, cycles: 1, joints: { r_sh_flex: { offset: 0, amplitude: 10, phase: 90 } } },
    ] }, body).ok).toBe(true);
  });

  it('names an unknown dof in start, move and harmonic', () => {
    const issues = issuesOf({ start: { elbow: 3 }, steps: [
      { kind: 'move', duration: 1, to: { r_sh_flx: 3 } },
      { kind: 'harmonic', period: 1, cycles: 1, joints: { knee: { offset: 0, amplitude: 1, phase: 0 } } },
    ] });
    expect(issues.map((i) => i.path)).toEqual(['start.elbow', 'steps[0].to.r_sh_flx', 'steps[1].joints.knee']);
    expect(issues[1].message).toMatch(/step 0 \(move\): unknown dof 'r_sh_flx'/);
  });

  it('names the step and field of a non-positive duration, period or cycles', () => {
    const issues = issuesOf({ steps: [
      { kind: 'move', duration: 0, to: {} },
      { kind: 'harmonic', period: -1, cycles: 1, joints: {} },
      { kind: 'harmonic', period: 1, cycles: 0, joints: {} },
    ] });
    expect(issues.map((i) => i.path)).toEqual(['steps[0].duration', 'steps[1].period', 'steps[2].cycles']);
    expect(issues[0].message).toMatch(/^step 0: steps\[0\]\.duration: duration must be positive/);
  });

  it('names an unknown step kind', () => {
    expect(issuesOf({ steps: [{ kind: 'spin', duration: 1 }] })[0].message).toMatch(/step 0:.*'move', 'harmonic', 'hold' or 'track'/);
  });

  it('rejects NaN and absurd angles, naming the field', () => {
    expect(issuesOf({ steps: [{ kind: 'move', duration: 1, to: { r_sh_flex: NaN } }] })[0].path).toBe('steps[0].to.r_sh_flex');
    expect(issuesOf({ steps: [{ kind: 'move', duration: 1, to: { r_sh_flex: 1e6 } }] })[0].message).toMatch(/≤ 3600°/);
  });
});
