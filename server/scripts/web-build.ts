import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

import { compressWebBuild } from './compress-web.ts';

const SOURCE_DIRS = ['app', 'components', 'scene', 'shared', 'assets'];
const SOURCE_FILES = ['app.json', 'metro.config.mjs', 'package-lock.json'];

function newestMtime(root: string, entries: string[]): number {
  let newest = 0;
  const visit = (p: string) => {
    if (!existsSync(p)) return;
    const st = statSync(p);
    if (st.isDirectory()) for (const e of readdirSync(p)) visit(path.join(p, e));
    else newest = Math.max(newest, st.mtimeMs);
  };
  for (const e of entries) visit(path.join(root, e));
  return newest;
}

/** Exports the web app with Expo (Metro) into `out` when it is missing or older than its sources. */
export function ensureWebBuild(root: string, out: string, log: (s: string) => void = console.error): void {
  const index = path.join(out, 'index.html');
  const built = existsSync(index) ? statSync(index).mtimeMs : 0;
  if (built && built >= newestMtime(root, [...SOURCE_DIRS, ...SOURCE_FILES])) {
    log(`Web app is up to date in ${out}.`);
    return;
  }
  log('Building the web app (expo export; about a minute on a cold cache)…');
  const res = spawnSync('npx', ['expo', 'export', '--platform', 'web', '--output-dir', out], {
    cwd: root,
    stdio: ['ignore', 'pipe', 'pipe'],
    encoding: 'utf8',
    env: { ...process.env, CI: '1', EXPO_NO_TELEMETRY: '1' },
  });
  if (res.status !== 0) {
    throw new Error(`expo export failed:\n${res.stdout}\n${res.stderr}`);
  }
  log(`Web app built (${compressWebBuild(out)} assets pre-compressed).`);
}
