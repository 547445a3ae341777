/**
 * npm run bench:web — the gzipped JavaScript each main route loads, from the `expo export` output in
 * dist/web (run `npm run build:web` first). The app is a single-page export: every route loads the
 * entry scripts that index.html names; every screen behind sign-in also loads the signed-in screens
 * chunk, and routes that show the 3D player its chunk too. `-- --json` ends with one JSON object.
 * Fails (exit 1) when sign-in's first load exceeds SIGN_IN_BUDGET_KB.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

/** Sign-in's first-load budget, KB of gzipped JavaScript (the product's performance target). */
const SIGN_IN_BUDGET_KB = 350;
const JSON_OUT = process.argv.includes('--json');

const root = fileURLToPath(new URL('../../dist/web/', import.meta.url).href);
const indexHtml = path.join(root, 'index.html');
if (!existsSync(indexHtml)) {
  console.error(`No web export at ${root}: run \`npm run build:web\` first.`);
  process.exit(1);
}

const kb = (bytes: number) => bytes / 1024;
const gz = (file: string) => gzipSync(readFileSync(file), { level: 9 }).length;

// Entry scripts: every <script src> of index.html.
const html = readFileSync(indexHtml, 'utf8');
const entry = [...html.matchAll(/<script[^>]+src="([^"]+\.js)"/g)].map((m) => m[1].replace(/^\//, ''));
// Lazy chunks: every other .js file of the export, by the module name Metro gives it.
const jsDir = path.join(root, '_expo', 'static', 'js', 'web');
const all = existsSync(jsDir) ? readdirSync(jsDir).filter((f) => f.endsWith('.js')).map((f) => `_expo/static/js/web/${f}`) : [];
const lazy = all.filter((f) => !entry.includes(f));
const sizes = new Map([...entry, ...lazy].map((f) => [f, { raw: readFileSync(path.join(root, f)).length, gzip: gz(path.join(root, f)) }]));
const chunkNamed = (name: string) => lazy.filter((f) => path.basename(f).startsWith(`${name}-`));
const player = chunkNamed('RehearsalPlayer');
const screens = chunkNamed('signed-in-screens');
const signedIn = [...entry, ...screens];
if (!player.length || !screens.length) {
  console.error('The export has no RehearsalPlayer or signed-in-screens chunk: were the lazy imports removed?');
  process.exit(1);
}

/** Main routes and the chunks each loads on first visit. */
const routes: { route: string; chunks: string[] }[] = [
  { route: '/sign-in', chunks: entry },
  { route: '/rehearse (list)', chunks: signedIn },
  { route: '/rehearse/[versionId] (3D player)', chunks: [...signedIn, ...player] },
  { route: '/crew', chunks: signedIn },
  { route: '/maneuvers', chunks: signedIn },
  { route: '/maneuvers/… (composer, report with 3D preview)', chunks: [...signedIn, ...player] },
  { route: '/reviews', chunks: signedIn },
  { route: '/team', chunks: signedIn },
];

console.log('Chunks (KB):');
for (const [f, s] of sizes) console.log(`  ${entry.includes(f) ? 'entry' : 'lazy '}  ${kb(s.raw).toFixed(0).padStart(6)} raw  ${kb(s.gzip).toFixed(1).padStart(7)} gzip  ${path.basename(f)}`);
console.log('\nGzipped JavaScript loaded per route (KB):');
const signIn = routes[0].chunks.reduce((t, f) => t + (sizes.get(f)?.gzip ?? 0), 0);
for (const r of routes) {
  const total = r.chunks.reduce((t, f) => t + (sizes.get(f)?.gzip ?? 0), 0);
  console.log(`  ${r.route.padEnd(50)} ${kb(total).toFixed(1).padStart(8)}   ×${(total / signIn).toFixed(2)} of sign-in`);
}
const threeShare = player.reduce((t, f) => t + (sizes.get(f)?.gzip ?? 0), 0);
const screensShare = screens.reduce((t, f) => t + (sizes.get(f)?.gzip ?? 0), 0);
console.log(`\nSigned-in screens chunk (every screen, composer, charts, forms, zod): ${kb(screensShare).toFixed(1)} KB gzip, loaded after sign-in.`);
console.log(`3D player chunk (three, fiber, drei OrbitControls, scene): ${kb(threeShare).toFixed(1)} KB gzip, loaded only where the player shows.`);
console.log(`Sign-in first load: ${kb(signIn).toFixed(1)} KB gzip (budget ${SIGN_IN_BUDGET_KB} KB) — ${kb(signIn) <= SIGN_IN_BUDGET_KB ? 'within budget' : 'OVER BUDGET'}.`);
// What the server really sends a browser that accepts brotli: the build's own .br copies (server/scripts/compress-web.ts).
const brOf = (f: string) => (existsSync(path.join(root, `${f}.br`)) ? readFileSync(path.join(root, `${f}.br`)).length : null);
const signInBr = routes[0].chunks.map(brOf);
const signInBrKB = signInBr.every((b) => b !== null) ? +kb(signInBr.reduce((t: number, b) => t + (b ?? 0), 0)).toFixed(1) : null;
console.log(signInBrKB === null
  ? 'No .br copies in this build (built before pre-compression?): the server would send these files uncompressed; rebuild with `npm run build:web`.'
  : `As sent to a browser accepting brotli (the build's .br copies): sign-in ${signInBrKB} KB.`);
console.log(`Peak memory: ${(process.memoryUsage().rss / 1024 / 1024).toFixed(0)} MB RSS`);
const playerTotal = routes[2].chunks.reduce((t, f) => t + (sizes.get(f)?.gzip ?? 0), 0);
if (JSON_OUT) {
  console.log(JSON.stringify({
    signInGzipKB: +kb(signIn).toFixed(1), playerGzipKB: +kb(playerTotal).toFixed(1),
    signedInScreensGzipKB: +kb(screensShare).toFixed(1), playerChunkGzipKB: +kb(threeShare).toFixed(1), signInBudgetKB: SIGN_IN_BUDGET_KB, signInBrotliKB: signInBrKB,
  }));
}
if (kb(signIn) > SIGN_IN_BUDGET_KB) process.exit(1);
