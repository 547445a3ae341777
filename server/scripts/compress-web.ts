/**
 * Pre-compressed copies of the web build's text assets (`x.js` → `x.js.br`, `x.js.gz`), made once at
 * build time so the server sends the sizes `npm run bench:web` reports without compressing the
 * 1.3 MB bundle on every request. express-static-gzip picks the copy the browser accepts.
 */
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

/** Extensions worth compressing (images and fonts are compressed already or gain little). */
const TEXT_EXTENSIONS = new Set(['.js', '.css', '.html', '.json', '.map', '.svg', '.txt', '.ttf']);
/** Smaller files are sent as they are: the `compression` package's default threshold (1 KB). */
const MIN_BYTES = 1024;

/** Writes `.br` and `.gz` beside every text asset of `dir` (recursively); returns how many files it compressed. */
export function compressWebBuild(dir: string): number {
  let count = 0;
  const visit = (p: string) => {
    const st = statSync(p);
    if (st.isDirectory()) { for (const e of readdirSync(p)) visit(path.join(p, e)); return; }
    if (!TEXT_EXTENSIONS.has(path.extname(p)) || st.size < MIN_BYTES) return;
    const raw = readFileSync(p);
    writeFileSync(`${p}.gz`, gzipSync(raw, { level: 9 }));
    writeFileSync(`${p}.br`, brotliCompressSync(raw, { params: { [constants.BROTLI_PARAM_QUALITY]: 11, [constants.BROTLI_PARAM_SIZE_HINT]: raw.length } }));
    count += 1;
  };
  visit(dir);
  return count;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const dir = path.resolve(process.argv[2] ?? 'dist/web');
  console.log(`Compressed ${compressWebBuild(dir)} web assets in ${dir} (.br and .gz beside each).`);
}
