/**
 * Runs a body and sequence in MuJoCo's WebAssembly build (mujoco-js), as a general-purpose physics
 * reference: MJCF from the body contract (free root joint, one hinge per dof — several hinges in one
 * MuJoCo body compose in order, each about its axis in the frame left by the previous ones, the
 * contract's rule), zero gravity, and stiff position servos tracking the prescribed joint angles with
 * velocity feed-forward (ctrl = θ_ref + (kv/kp)·θ̇_ref, so the servo force is kp·e + kv·ė).
 */
import loadMujoco from 'mujoco-js';

import { compileMotion, evalPiece, pieceAt } from '../../server/engine/joint-motion.ts';
import type { Body } from '../../shared/contracts/body.ts';
import type { Sequence } from '../../shared/contracts/sequence.ts';
import { compileBody } from '../../shared/kinematics/body-model.ts';

/** Servo gains: stiffness N·m/rad and damping N·m·s/rad (implicit in MuJoCo's implicitfast integrator). */
export const SERVO_KP = 2e5;
export const SERVO_KV = 2e3;

/** What a MuJoCo run reports. */
export interface MujocoRun {
  /** Final root attitude [w,x,y,z]. */
  attitude: number[];
  /** Max |joint angle − reference| over the run, rad. */
  maxTrackingError: number;
  /** Max ‖total angular momentum‖ about the system CoM over the run, kg·m²/s. */
  maxMomentum: number;
  /** Steps taken. */
  steps: number;
}

type Mj = Awaited<ReturnType<typeof loadMujoco>>;
let mjPromise: Promise<Mj> | null = null;
/** The MuJoCo module (loaded once per process). */
export function mujoco(): Promise<Mj> { mjPromise ??= loadMujoco(); return mjPromise; }

const f = (v: number) => v.toPrecision(17);

/** MJCF for a body, and its dof names in MuJoCo's joint order (depth-first). */
export function bodyToMjcf(body: Body, timestep: number): { xml: string; dofOrder: string[] } {
  const children = new Map<string, Body['segments']>();
  for (const s of body.segments) if (s.parent) children.set(s.parent, [...(children.get(s.parent) ?? []), s]);
  const dofOrder: string[] = [];
  const inertial = (s: Body['segments'][number]) => {
    const [a, b, c, d = 0, e = 0, g = 0] = s.inertia;
    return `<inertial pos="${s.com.map(f).join(' ')}" mass="${f(s.mass)}" fullinertia="${[a, b, c, d, e, g].map(f).join(' ')}"/>`;
  };
  const emit = (s: Body['segments'][number]): string => {
    const joints = s.parent
      ? s.joint!.dofs.map((d) => { dofOrder.push(d.name); return `<joint name="${d.name}" type="hinge" pos="0 0 0" axis="${d.axis.map(f).join(' ')}"/>`; }).join('')
      : '<freejoint name="root"/>';
    const pos = s.parent ? s.joint!.origin.map(f).join(' ') : '0 0 0';
    return `<body name="${s.name}" pos="${pos}">${joints}${inertial(s)}${(children.get(s.name) ?? []).map(emit).join('')}</body>`;
  };
  const root = body.segments.find((s) => !s.parent)!;
  const tree = emit(root);
  const actuators = dofOrder.map((d) => `<position joint="${d}" kp="${SERVO_KP}" kv="${SERVO_KV}"/>`).join('');
  const xml = `<mujoco><compiler angle="radian" autolimits="true"/>`
    + `<option gravity="0 0 0" timestep="${timestep}" integrator="implicitfast"/>`
    + `<worldbody>${tree}</worldbody><actuator>${actuators}</actuator></mujoco>`;
  return { xml, dofOrder };
}

/** Runs the maneuver with a fixed time step (s). */
/** MuJoCo's state arrays are typed `any` by mujoco-js; they are views of doubles (mjtNum). */
function doubles(view: unknown): Float64Array {
  if (!(view instanceof Float64Array)) throw new Error('mujoco-js: expected a Float64Array view of the state');
  return view;
}

export async function runMujoco(body: Body, seq: Sequence, timestep: number): Promise<MujocoRun> {
  const mj = await mujoco();
  const model = compileBody(body);
  const plan = compileMotion(model, seq);
  const { xml, dofOrder } = bodyToMjcf(body, timestep);
  const path = `/holonaut-${Math.random().toString(36).slice(2)}.xml`;
  mj.FS.writeFile(path, xml);
  const m = mj.MjModel.loadFromXML(path);
  const d = new mj.MjData(m);
  try {
    const idx = dofOrder.map((n) => model.dofIndex.get(n)!);
    const q = new Float64Array(model.dofCount), qd = new Float64Array(model.dofCount);
    // Start posture and rates of the first piece.
    const setRef = (t: number) => {
      const p = pieceAt(plan, t);
      if (p) evalPiece(p, t, q, qd); else { q.set(plan.start); qd.fill(0); }
    };
    setRef(0);
    { const qpos = doubles(d.qpos); idx.forEach((k, j) => { qpos[7 + j] = q[k]; }); }
    { const qvel = doubles(d.qvel); idx.forEach((k, j) => { qvel[6 + j] = qd[k]; }); }
    // Zero total momentum at the start: solve the root's velocity with MuJoCo's own momentum, by linearity.
    mj.mj_forward(m, d);
    const momentum = () => { mj.mj_subtreeVel(m, d); const a = doubles(d.subtree_angmom); return [a[3], a[4], a[5]]; };
    const base = momentum();
    const cols: number[][] = [];
    for (let c = 0; c < 3; c++) {
      const v = doubles(d.qvel); v[3] = c === 0 ? 1 : 0; v[4] = c === 1 ? 1 : 0; v[5] = c === 2 ? 1 : 0;
      mj.mj_forward(m, d);
      const h = momentum();
      cols.push(h.map((x, i) => x - base[i]));
    }
    const w = solve3(cols, base.map((x) => -x));
    { const v = doubles(d.qvel); v[3] = w[0]; v[4] = w[1]; v[5] = w[2]; }
    mj.mj_forward(m, d);
    const n = Math.round(plan.duration / timestep);
    let maxErr = 0, maxH = 0;
    for (let s = 0; s < n; s++) {
      const t = s * timestep;
      setRef(t);
      const ctrl = doubles(d.ctrl);
      idx.forEach((k, j) => { ctrl[j] = q[k] + (SERVO_KV / SERVO_KP) * qd[k]; });
      mj.mj_step(m, d);
      setRef((s + 1) * timestep);
      const qpos = doubles(d.qpos);
      idx.forEach((k, j) => { maxErr = Math.max(maxErr, Math.abs(qpos[7 + j] - q[k])); });
      if (s % 50 === 0) { const h = momentum(); maxH = Math.max(maxH, Math.hypot(h[0], h[1], h[2])); }
    }
    const xq = doubles(d.xquat);
    const att = [xq[4], xq[5], xq[6], xq[7]];
    return { attitude: att, maxTrackingError: maxErr, maxMomentum: maxH, steps: n };
  } finally {
    d.delete(); m.delete();
    mj.FS.unlink(path);
  }
}

function solve3(cols: number[][], b: number[]): number[] {
  const A = [0, 1, 2].map((r) => [cols[0][r], cols[1][r], cols[2][r], b[r]]);
  for (let p = 0; p < 3; p++) {
    let piv = p;
    for (let r = p + 1; r < 3; r++) if (Math.abs(A[r][p]) > Math.abs(A[piv][p])) piv = r;
    [A[p], A[piv]] = [A[piv], A[p]];
    for (let r = 0; r < 3; r++) if (r !== p) { const k = A[r][p] / A[p][p]; for (let c = p; c < 4; c++) A[r][c] -= k * A[p][c]; }
  }
  return [A[0][3] / A[0][0], A[1][3] / A[1][1], A[2][3] / A[2][2]];
}
