/** Loads odex (CommonJS) through createRequire so tsc, tsx and vitest agree on its hand-written types. */
import { createRequire } from 'node:module';

import type { OdexModule } from './odex.d.ts';

/** odex's exports: `Solver` and `Outcome`. */
export const odex = createRequire(import.meta.url)('odex') as OdexModule;
