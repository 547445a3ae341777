/**
 * ENGINE_VERSION hashes exactly the engine's inputs: the import closure of server/engine/simulate.ts.
 * This list pins that set, so adding an engine import (or dropping one) is a deliberate, reviewed change.
 */
import { describe, expect, it } from 'vitest';

import { ENGINE_SEMVER, ENGINE_VERSION, engineInputFiles } from '../../server/engine/version.ts';

const ENGINE_INPUTS = [
  'server/engine/integrate-attitude.ts',
  'server/engine/joint-motion.ts',
  'server/engine/joint-range.ts',
  'server/engine/locked-momentum.ts',
  'server/engine/magnus.ts',
  'server/engine/momentum-audit.ts',
  'server/engine/rate-nodes.ts',
  'server/engine/rigid-merge.ts',
  'server/engine/simulate.ts',
  'server/engine/track-audit.ts',
  'server/engine/version.ts',
  'shared/contracts/body.ts',
  'shared/contracts/contract-issue.ts',
  'shared/contracts/result.ts',
  'shared/contracts/sequence.ts',
  'shared/contracts/simulate-request.ts',
  'shared/kinematics/body-model.ts',
  'shared/kinematics/forward-kinematics.ts',
  'shared/math/euler-zyx.ts',
  'shared/math/float64-block.ts',
  'shared/math/inertia.ts',
  'shared/math/mat3.ts',
  'shared/math/minimum-jerk.ts',
  'shared/math/natural-cubic-spline.ts',
  'shared/math/path-travelled.ts',
  'shared/math/quaternion.ts',
  'shared/math/symmetric-eigen.ts',
  'shared/math/vec3.ts',
];

describe('ENGINE_VERSION', () => {
  it('hashes exactly the files the engine imports', () => {
    expect(engineInputFiles()).toEqual(ENGINE_INPUTS);
  });

  it('leaves out what the engine does not read: the star field\'s generator, the worker pool, the planner', () => {
    const files = engineInputFiles();
    expect(files).not.toContain('shared/math/seeded-random.ts');
    expect(files.some((f) => f.startsWith('server/engine/pool/') || f.startsWith('server/planning/'))).toBe(false);
  });

  it('is the semver plus a 12-digit hash', () => {
    expect(ENGINE_VERSION).toMatch(new RegExp(`^${ENGINE_SEMVER.replace(/\./g, '\\.')}\\+[0-9a-f]{12}$`));
  });
});
