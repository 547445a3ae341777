/**
 * Reading a BVH motion-capture file. A line-by-line check first (three's loader logs and carries on
 * past a malformed file, so every problem is found here and named by line and channel), then
 * three's BVHLoader (three/examples/jsm, no DOM needed) turns each frame's Euler channels into joint
 * quaternions, in the channel order the file declares.
 */
import { BVHLoader } from 'three/examples/jsm/loaders/BVHLoader.js';

import type { BvhJointInfo } from '../../shared/contracts/recording.ts';
import type { UploadRowError } from '../../shared/contracts/uploads.ts';

const CHANNEL_NAMES = ['Xposition', 'Yposition', 'Zposition', 'Xrotation', 'Yrotation', 'Zrotation'];
const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/** A BVH file read into joint rotations. */
export interface BvhMotion {
  joints: BvhJointInfo[];
  /** Rest offset of each joint from its parent (file units), by name. */
  offsets: Map<string, [number, number, number]>;
  /** Offset of each joint's first child (or End Site) from it: the bone's rest direction, by name. */
  boneDirections: Map<string, [number, number, number]>;
  /** Seconds per frame. */
  frameTime: number;
  frameCount: number;
  /** Local rotation of each joint per frame, [x, y, z, w] × frames, relative to its parent, file axes. */
  local: Map<string, Float64Array>;
}

interface Declared { name: string; parent: string | null; channels: string[]; line: number; offset: [number, number, number] | null; child: [number, number, number] | null }

/**
 * Checks the file's structure: HIERARCHY with ROOT/JOINT/End Site blocks, OFFSET and CHANNELS on
 * each joint, MOTION with `Frames:` and `Frame Time:`, then one line per frame with one number per
 * declared channel. Returns every problem (line = row, the channel = column) and the declared joints.
 */
export function checkBvh(text: string): { errors: UploadRowError[]; declared: Declared[]; frames: number; channelCount: number; frameTime: number } {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const errors: UploadRowError[] = [];
  const declared: Declared[] = [];
  const stack: (Declared | 'end')[] = [];
  let i = 0;
  const skipBlank = () => { while (i < lines.length && lines[i].trim() === '') i++; };
  skipBlank();
  if (lines[i]?.trim() !== 'HIERARCHY') {
    return { errors: [{ row: i + 1, column: '', reason: 'a BVH file starts with HIERARCHY' }], declared, frames: 0, channelCount: 0, frameTime: 0 };
  }
  i++;
  let pending: Declared | 'end' | null = null;
  for (; i < lines.length; i++) {
    const line = lines[i].trim();
    if (line === '') continue;
    if (line === 'MOTION') break;
    const tok = line.split(/\s+/);
    const row = i + 1;
    const top = stack[stack.length - 1];
    const parentJoint = [...stack].reverse().find((s): s is Declared => s !== 'end');
    if (tok[0] === 'ROOT' || tok[0] === 'JOINT') {
      if (!tok[1]) errors.push({ row, column: tok[0], reason: 'a joint needs a name' });
      if (tok[0] === 'ROOT' && declared.length) errors.push({ row, column: 'ROOT', reason: 'only one ROOT is supported' });
      const joint: Declared = { name: tok[1] ?? `joint_${row}`, parent: parentJoint?.name ?? null, channels: [], line: row, offset: null, child: null };
      if (declared.some((d) => d.name === joint.name)) errors.push({ row, column: tok[0], reason: `joint name '${tok[1]}' appears twice` });
      declared.push(joint);
      pending = joint;
    } else if (tok[0] === 'End' && tok[1] === 'Site') {
      pending = 'end';
    } else if (tok[0] === '{') {
      if (!pending) { errors.push({ row, column: '', reason: "'{' without a ROOT, JOINT or End Site before it" }); continue; }
      stack.push(pending);
      pending = null;
    } else if (tok[0] === '}') {
      if (!stack.length) { errors.push({ row, column: '', reason: "'}' closes nothing" }); continue; }
      const closed = stack.pop()!;
      if (closed !== 'end' && closed.offset === null) errors.push({ row: closed.line, column: 'OFFSET', reason: `joint '${closed.name}' has no OFFSET` });
    } else if (tok[0] === 'OFFSET') {
      const nums = tok.slice(1);
      if (nums.length !== 3 || nums.some((v) => !NUMBER.test(v))) { errors.push({ row, column: 'OFFSET', reason: `OFFSET needs three numbers (got "${nums.join(' ')}")` }); continue; }
      const v = nums.map(Number) as [number, number, number];
      if (top === 'end') { if (parentJoint && !parentJoint.child) parentJoint.child = v; } else if (top) {
        top.offset = v;
        // The first child's offset is the parent's bone direction.
        const grand = [...stack].slice(0, -1).reverse().find((s): s is Declared => s !== 'end');
        if (grand && !grand.child) grand.child = v;
      }
    } else if (tok[0] === 'CHANNELS') {
      if (!top || top === 'end') { errors.push({ row, column: 'CHANNELS', reason: 'CHANNELS outside a joint' }); continue; }
      const n = Number(tok[1]);
      const names = tok.slice(2);
      if (!Number.isInteger(n) || n < 1 || n > 6) errors.push({ row, column: 'CHANNELS', reason: `the channel count must be 1–6 (got "${tok[1] ?? ''}")` });
      else if (names.length !== n) errors.push({ row, column: 'CHANNELS', reason: `CHANNELS says ${n} but names ${names.length}` });
      const bad = names.filter((c) => !CHANNEL_NAMES.includes(c));
      if (bad.length) errors.push({ row, column: 'CHANNELS', reason: `unknown channel ${bad.map((b) => `'${b}'`).join(', ')}; channels are ${CHANNEL_NAMES.join(', ')}` });
      top.channels = names;
    } else {
      errors.push({ row, column: '', reason: `unexpected "${line.slice(0, 40)}" in the HIERARCHY section` });
    }
  }
  if (stack.length) errors.push({ row: i, column: '', reason: `${stack.length} block(s) not closed with '}'` });
  for (const d of declared) if (d.channels.length === 0) errors.push({ row: d.line, column: 'CHANNELS', reason: `joint '${d.name}' has no CHANNELS line` });
  if (!declared.length) errors.push({ row: i + 1, column: 'ROOT', reason: 'no ROOT joint in the HIERARCHY section' });
  const channelCount = declared.reduce((s, d) => s + d.channels.length, 0);
  if (i >= lines.length) {
    errors.push({ row: lines.length, column: 'MOTION', reason: 'the MOTION section is missing' });
    return { errors, declared, frames: 0, channelCount, frameTime: 0 };
  }
  // MOTION: Frames, Frame Time, then the frames.
  i++;
  skipBlank();
  const framesMatch = /^Frames:\s*(\S+)$/.exec(lines[i]?.trim() ?? '');
  const frames = framesMatch && /^\d+$/.test(framesMatch[1]) ? Number(framesMatch[1]) : NaN;
  if (!Number.isFinite(frames)) errors.push({ row: i + 1, column: 'Frames', reason: 'expected "Frames: N" with a whole number' });
  i++;
  skipBlank();
  const timeMatch = /^Frame Time:\s*(\S+)$/.exec(lines[i]?.trim() ?? '');
  const frameTime = timeMatch && NUMBER.test(timeMatch[1]) ? Number(timeMatch[1]) : NaN;
  if (!(frameTime > 0)) errors.push({ row: i + 1, column: 'Frame Time', reason: 'expected "Frame Time: S" with a positive number of seconds' });
  i++;
  const channelLabels = declared.flatMap((d) => d.channels.map((c) => `${d.name} ${c}`));
  let seen = 0;
  for (; i < lines.length && errors.length < 200; i++) {
    const line = lines[i].trim();
    if (line === '') continue;
    seen++;
    const vals = line.split(/\s+/);
    const row = i + 1;
    if (vals.length !== channelCount) {
      errors.push({ row, column: '', reason: `frame ${seen} has ${vals.length} values but the hierarchy declares ${channelCount} channels` });
      continue;
    }
    vals.forEach((v, k) => { if (!NUMBER.test(v)) errors.push({ row, column: channelLabels[k], reason: `"${v}" is not a number` }); });
  }
  if (Number.isFinite(frames) && seen !== frames) {
    errors.push({ row: lines.length, column: 'Frames', reason: `"Frames: ${frames}" but the file holds ${seen} frame lines` });
  }
  if (seen === 0 && errors.length === 0) errors.push({ row: lines.length, column: 'Frames', reason: 'the file holds no frames' });
  return { errors, declared, frames: seen, channelCount, frameTime };
}

/** Reads a BVH file; `errors` lists every problem by line, and `motion` is null when there is any. */
export function readBvh(text: string): { errors: UploadRowError[]; motion: BvhMotion | null } {
  const check = checkBvh(text);
  if (check.errors.length) return { errors: check.errors, motion: null };
  const { skeleton, clip } = new BVHLoader().parse(text);
  const local = new Map<string, Float64Array>();
  for (const track of clip.tracks) {
    if (!track.name.endsWith('.quaternion')) continue;
    local.set(track.name.slice(0, -'.quaternion'.length), Float64Array.from(track.values));
  }
  // The frame time as written (three keeps times in single precision).
  const { frames: frameCount, frameTime } = check;
  const offsets = new Map<string, [number, number, number]>();
  const boneDirections = new Map<string, [number, number, number]>();
  for (const d of check.declared) {
    offsets.set(d.name, d.offset ?? [0, 0, 0]);
    if (d.child) boneDirections.set(d.name, d.child);
  }
  // Every declared joint has a quaternion track (three adds one per joint).
  for (const b of skeleton.bones) if (!local.has(b.name)) local.set(b.name, new Float64Array(4 * frameCount).map((_, k) => (k % 4 === 3 ? 1 : 0)));
  const joints: BvhJointInfo[] = check.declared.map((d) => ({ name: d.name, parent: d.parent, rotationChannels: d.channels.filter((c) => c.endsWith('rotation')) }));
  return { errors: [], motion: { joints, offsets, boneDirections, frameTime, frameCount, local } };
}
