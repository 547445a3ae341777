/**
 * ENGINE_VERSION: a semver constant plus a short hash of exactly the engine's inputs: the source
 * files `simulate.ts` reaches through its relative imports (the engine, the shared kinematics, math
 * and contracts it reads), found at load. Stored with every result so an approval binds to the exact
 * computation; a file the engine does not import (the star field's generator) never moves it.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { dirname, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Human-facing engine release. Bump on any change of physics or result shape. */
export const ENGINE_SEMVER = '1.1.0';

const ENGINE_ENTRY = fileURLToPath(new URL('./simulate.ts', import.meta.url).href);
const PROJECT_ROOT = fileURLToPath(new URL('../../', import.meta.url).href);
/** Relative module specifiers of static imports and re-exports (`import … from './x.ts'`, `export … from`). */
const RELATIVE_IMPORT = /(?:^|\n)\s*(?:import|export)\s[^;]*?from\s+'(\.{1,2}\/[^']+)'/g;

/**
 * The engine's input files, project-relative and sorted: the import closure of server/engine/simulate.ts
 * over relative imports (packages are pinned by package-lock.json, not hashed here).
 */
export function engineInputFiles(): string[] {
  const seen = new Set<string>();
  const stack = [ENGINE_ENTRY];
  while (stack.length) {
    const file = stack.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    for (const m of readFileSync(file, 'utf8').matchAll(RELATIVE_IMPORT)) stack.push(resolve(dirname(file), m[1]));
  }
  return [...seen].map((f) => relative(PROJECT_ROOT, f).split('\\').join('/')).sort();
}

function sourceHash(): string {
  const hash = createHash('sha256');
  for (const f of engineInputFiles()) {
    // The path too, so moving a file is a new version.
    hash.update(f);
    hash.update(readFileSync(resolve(PROJECT_ROOT, f)));
  }
  return hash.digest('hex').slice(0, 12);
}

/** `semver+hash`, e.g. `1.0.0+3fa9c2d1e0b4`. */
export const ENGINE_VERSION = `${ENGINE_SEMVER}+${sourceHash()}`;
