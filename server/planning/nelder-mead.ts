/**
 * The optimiser the planner refines with: fmin 0.0.4's Nelder–Mead. Two quirks of that release:
 * its `build/fmin.js` is a UMD bundle that exports nothing when Node loads it as ESM (the package
 * says "type": "module"), and its shrink step assigns an undeclared `i`, which throws in strict
 * code. So the bundle runs as a classic script in its own `vm` context, given `exports`/`module`
 * (the UMD's CommonJS branch) and a context-global `i` for that assignment; nothing leaks into ours.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import vm from 'node:vm';

import type { FminModule } from './fmin.d.ts';

export type { FminPoint, NelderMeadParameters, NelderMeadResult } from './fmin.d.ts';

function loadFmin(): FminModule {
  const file = createRequire(import.meta.url).resolve('fmin/build/fmin.js');
  const context = { exports: {} as Partial<FminModule>, module: {}, i: 0 };
  vm.runInNewContext(readFileSync(file, 'utf8'), context, { filename: file });
  if (typeof context.exports.nelderMead !== 'function') throw new Error('fmin did not load: no nelderMead export');
  return context.exports as FminModule;
}

/** fmin's nelderMead(f, x0, parameters) → { x, fx }. */
export const { nelderMead } = loadFmin();
