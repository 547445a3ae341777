/**
 * restrictToPiece is hidden state that bodyRate relies on: after it, bodyRate recomputes only the
 * piece's moving segments, treats the still ones as one rigid composite and folds still subtrees
 * into the moving segment that carries them. The regrouping is exact (the same sums, grouped
 * differently), so every check here is against the unrestricted computation on a fresh work
 * (round-off only) or against the whole-body inertia computed by another route (shared/model's
 * wholeBodyInertia through shared/math), and against the momentum balance itself.
 */
import { describe, expect, it } from 'vitest';

import { compileMotion, evalPiece, type MotionPiece } from '../../server/engine/joint-motion.ts';
import { bodyRate, createMomentumWork, restrictToPiece } from '../../server/engine/locked-momentum.ts';
import { deriveBody } from '../../server/model/derive-body.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';
import { wholeBodyInertia } from '../../shared/model/whole-body.ts';
import { mustSequence } from './fixtures.ts';

/** Round-off of a regrouped sum of about 20 terms, relative to the quantity's size (common practice). */
const REL = 1e-12;

const { body } = deriveBody({ sex: 'female', stature: 1.66, mass: 61 });
const model = compileBody(body);
const plan = compileMotion(model, mustSequence({
  start: { l_elbow_flex: 30 },
  steps: [
    // Only the right shoulder moves: forearm and hand are carried by the upper arm.
    { kind: 'move', duration: 1.2, to: { r_sh_flex: 90 } },
    // Shoulder and the left knee: two moving chains, the foot carried by the shank.
    { kind: 'harmonic', period: 1.5, cycles: 1, joints: { r_sh_flex: { offset: 90, amplitude: 30, phase: 0 }, l_knee_flex: { offset: 0, amplitude: 20, phase: 0 } } },
    { kind: 'hold', duration: 0.5 },
  ],
}, body));
const [move, harmonic, hold] = plan.pieces;
const seg = (name: string) => body.segments.findIndex((s) => s.name === name);

/** Angles and rates of a piece at a fraction of its duration. */
function stateAt(piece: MotionPiece, f: number) {
  const q = new Float64Array(model.dofCount), qd = new Float64Array(model.dofCount);
  evalPiece(piece, piece.t0 + f * (piece.t1 - piece.t0), q, qd);
  return { q, qd };
}

/** ω, I_lock and h from a fresh, unrestricted work (every segment recomputed). */
function unrestricted(q: Float64Array, qd: Float64Array) {
  const work = createMomentumWork(model);
  const omega = Array.from(bodyRate(model, q, qd, work));
  return { omega, lock: Array.from(work.lock), h: Array.from(work.h) };
}

const expectClose = (got: ArrayLike<number>, want: number[]) => {
  const scale = Math.max(...want.map(Math.abs), 1e-300);
  Array.from(got).forEach((v, k) => expect(Math.abs(v - want[k])).toBeLessThan(REL * scale));
};

describe('restrictToPiece', () => {
  it('a fresh work recomputes every segment (no piece yet)', () => {
    const work = createMomentumWork(model);
    expect(work.piece).toBeNull();
    expect(work.moving.length).toBe(model.segmentCount);
    expect(work.restMass).toBe(0);
  });

  for (const [label, piece] of [['move (shoulder only)', move], ['harmonic (shoulder and knee)', harmonic]] as const) {
    it(`${label}: ω, I_lock and h equal the unrestricted ones to round-off across the piece`, () => {
      const work = createMomentumWork(model);
      restrictToPiece(model, piece, work);
      for (const f of [0, 0.13, 0.5, 0.81, 1]) {
        const { q, qd } = stateAt(piece, f);
        const ref = unrestricted(q, qd);
        const omega = bodyRate(model, q, qd, work);
        expectClose(work.lock, ref.lock);
        expectClose(work.h, ref.h);
        expectClose(omega, ref.omega);
      }
    });
  }

  it('move: only the upper arm is recomputed; forearm and hand ride in it, everything else is one still composite', () => {
    const work = createMomentumWork(model);
    restrictToPiece(model, move, work);
    expect(Array.from(work.moving)).toEqual([seg('r_upper_arm')]);
    const carriedMass = ['r_upper_arm', 'r_forearm', 'r_hand'].reduce((m, n) => m + model.mass[seg(n)], 0);
    expect(work.pieceModel!.mass[seg('r_upper_arm')]).toBeCloseTo(carriedMass, 12);
    // Mass is conserved by the regrouping: still composite + folded moving segments = whole body.
    expect(work.restMass + carriedMass).toBeCloseTo(model.totalMass, 12);
  });

  it('hold: nothing moves, ω = 0, and I_lock equals the whole-body inertia computed by shared/model at that posture', () => {
    const work = createMomentumWork(model);
    restrictToPiece(model, hold, work);
    expect(work.moving.length).toBe(0);
    expect(work.restMass).toBeCloseTo(model.totalMass, 12);
    const { q, qd } = stateAt(hold, 0.5);
    expect(Array.from(bodyRate(model, q, qd, work)).every((w) => w === 0)).toBe(true);
    const posture = Object.fromEntries(Array.from(model.dofNames, (name, k) => [name, (q[k] * 180) / Math.PI]));
    expectClose(work.lock, wholeBodyInertia(body, posture).inertia);
  });

  it('zero total angular momentum: I_lock·ω + h = 0 after restriction', () => {
    const work = createMomentumWork(model);
    restrictToPiece(model, harmonic, work);
    const { q, qd } = stateAt(harmonic, 0.37);
    const w = bodyRate(model, q, qd, work), L = work.lock, h = work.h;
    const H = [0, 1, 2].map((r) => L[3 * r] * w[0] + L[3 * r + 1] * w[1] + L[3 * r + 2] * w[2] + h[r]);
    H.forEach((c) => expect(Math.abs(c)).toBeLessThan(REL * Math.hypot(h[0], h[1], h[2])));
  });

  it('the same piece again is a no-op; another piece re-restricts, and going back is still exact', () => {
    const work = createMomentumWork(model);
    restrictToPiece(model, move, work);
    const folded = work.pieceModel;
    restrictToPiece(model, move, work);
    expect(work.pieceModel).toBe(folded);
    restrictToPiece(model, harmonic, work);
    expect(work.piece).toBe(harmonic);
    expect(Array.from(work.moving)).toContain(seg('l_shank'));
    restrictToPiece(model, move, work);
    const { q, qd } = stateAt(move, 0.42);
    expectClose(bodyRate(model, q, qd, work), unrestricted(q, qd).omega);
  });
});
