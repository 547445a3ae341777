/**
 * ENGINE_VERSION: a semver constant plus a short hash of the engine's own source files and the
 * shared kinematics/math/contracts it depends on, computed at load. Stored with every result so an
 * approval binds to the exact computation.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** Human-facing engine release. Bump on any change of physics or result shape. */
export const ENGINE_SEMVER = '1.1.0';

const HASHED_DIRS = ['./', '../../shared/kinematics/', '../../shared/math/'];
const HASHED_FILES = ['../../shared/contracts/body.ts', '../../shared/contracts/sequence.ts', '../../shared/contracts/result.ts'];
/** Files in those folders that are not engine inputs (the star field's and the dispersion run's generator). */
const NOT_HASHED = new Set(['seeded-random.ts']);

function sourceHash(): string {
  const hash = createHash('sha256');
  const files: string[] = [];
  for (const dir of HASHED_DIRS) {
    const abs = fileURLToPath(new URL(dir, import.meta.url).href);
    for (const f of readdirSync(abs).filter((n) => n.endsWith('.ts') && !NOT_HASHED.has(n)).sort()) files.push(abs + f);
  }
  for (const f of HASHED_FILES) files.push(fileURLToPath(new URL(f, import.meta.url).href));
  for (const f of files) hash.update(readFileSync(f));
  return hash.digest('hex').slice(0, 12);
}

/** `semver+hash`, e.g. `1.0.0+3fa9c2d1e0b4`. */
export const ENGINE_VERSION = `${ENGINE_SEMVER}+${sourceHash()}`;
