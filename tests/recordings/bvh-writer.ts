/**
 * Writes BVH text for tests: the widespread Hips / Spine / Chest / Neck / Head / LeftShoulder /
 * LeftArm / LeftForeArm / LeftHand / LeftUpLeg / LeftLeg / LeftFoot (and Right…) skeleton, in
 * centimetres, Y up, facing +Z, arms hanging down or in a T-pose.
 */
export const BVH_JOINTS = [
  'Hips', 'Spine', 'Chest', 'Neck', 'Head', 'LeftShoulder', 'LeftArm', 'LeftForeArm', 'LeftHand',
  'RightShoulder', 'RightArm', 'RightForeArm', 'RightHand', 'LeftUpLeg', 'LeftLeg', 'LeftFoot', 'RightUpLeg', 'RightLeg', 'RightFoot',
] as const;
export type BvhJoint = (typeof BVH_JOINTS)[number];

/** Rotation (degrees) per joint per frame in the channel order Z, X, Y; missing joints are 0. */
export type BvhFrame = Partial<Record<BvhJoint, [number, number, number]>>;

/** BVH text for frames at `frameTime` seconds; `pose` sets the arms' rest direction. */
export function writeBvh(frames: BvhFrame[], frameTime: number, pose: 'arms-down' | 't-pose' = 'arms-down'): string {
  const arm = (s: number) => (pose === 't-pose' ? [s * 28, 0, 0] : [0, -28, 0]);
  const fore = (s: number) => (pose === 't-pose' ? [s * 25, 0, 0] : [0, -25, 0]);
  const rot = 'CHANNELS 3 Zrotation Xrotation Yrotation';
  const j = (name: string, off: number[], body: string) => `JOINT ${name}\n{\nOFFSET ${off.join(' ')}\n${rot}\n${body}}\n`;
  const end = (off: number[]) => `End Site\n{\nOFFSET ${off.join(' ')}\n}\n`;
  const armChain = (side: 'Left' | 'Right', s: number) =>
    j(`${side}Shoulder`, [s * 3, 12, 0], j(`${side}Arm`, [s * 15, 0, 0], j(`${side}ForeArm`, arm(s), j(`${side}Hand`, fore(s), end(pose === 't-pose' ? [s * 8, 0, 0] : [0, -8, 0])))));
  const legChain = (side: 'Left' | 'Right', s: number) =>
    j(`${side}UpLeg`, [s * 9, 0, 0], j(`${side}Leg`, [0, -42, 0], j(`${side}Foot`, [0, -40, 0], end([0, -5, 12]))));
  const chest = j('Chest', [0, 10, 0], j('Neck', [0, 15, 0], j('Head', [0, 5, 0], end([0, 10, 0]))) + armChain('Left', 1) + armChain('Right', -1));
  const hierarchy = `HIERARCHY\nROOT Hips\n{\nOFFSET 0 0 0\nCHANNELS 6 Xposition Yposition Zposition Zrotation Xrotation Yrotation\n${j('Spine', [0, 10, 0], chest)}${legChain('Left', 1)}${legChain('Right', -1)}}\n`;
  // Channel order in the file: depth-first, as declared.
  const order: BvhJoint[] = ['Hips', 'Spine', 'Chest', 'Neck', 'Head', 'LeftShoulder', 'LeftArm', 'LeftForeArm', 'LeftHand', 'RightShoulder', 'RightArm', 'RightForeArm', 'RightHand', 'LeftUpLeg', 'LeftLeg', 'LeftFoot', 'RightUpLeg', 'RightLeg', 'RightFoot'];
  const lines = frames.map((f) => ['0 90 0', ...order.map((n) => (f[n] ?? [0, 0, 0]).join(' '))].join(' '));
  return `${hierarchy}MOTION\nFrames: ${frames.length}\nFrame Time: ${frameTime}\n${lines.join('\n')}\n`;
}
