/**
 * `npm run simulate -- BODY.json SEQUENCE.json [--rate HZ] [--rtol X]`: prints the result JSON on
 * stdout and nothing else; errors go to stderr with a non-zero exit, never a stack trace for bad input.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';

import { SIMULATE_LIMITS, simulateOptionsSchema } from '../../shared/contracts/simulate-request.ts';
import { simulateJson } from '../engine/simulate.ts';

const HELP = `Usage: npm run simulate -- BODY.json SEQUENCE.json [--rate HZ] [--rtol X]

Simulates a body (body contract JSON) performing a sequence (sequence contract JSON) in free fall
with zero angular momentum, and prints the result JSON on stdout: final attitude {w,x,y,z},
rotation angle/axis, yaw-pitch-roll (z-y'-x'', degrees), momentum audit, range violations,
peak joint rates, samples and solver statistics.

Options:
  --rate HZ   sample rate of "samples" (${SIMULATE_LIMITS.minRateHz}–${SIMULATE_LIMITS.maxRateHz} Hz, default 60)
  --rtol X    relative tolerance of the adaptive integrator (${SIMULATE_LIMITS.minRtol}–${SIMULATE_LIMITS.maxRtol}, default 1e-10)
  -h, --help  show this help

Exit codes: 0 success, 1 invalid input (the error names the file, field and reason), 2 usage, 3 engine failure.`;

/** Writes an error line to stderr and exits. */
function die(code: number, message: string): never {
  process.stderr.write(`simulate: ${message}\n`);
  process.exit(code);
}

function readJson(path: string, what: string): unknown {
  let text: string;
  try { text = readFileSync(path, 'utf8'); } catch (err) {
    die(1, `cannot read ${what} file '${path}': ${(err as NodeJS.ErrnoException).code ?? String(err)}`);
  }
  try { return JSON.parse(text); } catch (err) {
    die(1, `${what} file '${path}' is not valid JSON: ${(err as Error).message}`);
  }
}

function main(): void {
  let parsed;
  try {
    parsed = parseArgs({
      allowPositionals: true,
      options: { rate: { type: 'string' }, rtol: { type: 'string' }, help: { type: 'boolean', short: 'h' } },
    });
  } catch (err) {
    die(2, `${(err as Error).message}\n\n${HELP}`);
  }
  if (parsed.values.help) { process.stdout.write(`${HELP}\n`); return; }
  if (parsed.positionals.length !== 2) die(2, `expected BODY.json and SEQUENCE.json\n\n${HELP}`);
  const num = (v: string | undefined, name: string) => {
    if (v === undefined) return undefined;
    const n = Number(v);
    if (!Number.isFinite(n)) die(2, `--${name} must be a number (got '${v}')`);
    return n;
  };
  const opts = simulateOptionsSchema.safeParse({ rateHz: num(parsed.values.rate, 'rate'), rtol: num(parsed.values.rtol, 'rtol') });
  if (!opts.success) die(2, opts.error.issues.map((i) => i.message).join('; '));
  const [bodyPath, seqPath] = parsed.positionals;
  const body = readJson(bodyPath, 'body');
  const seq = readJson(seqPath, 'sequence');
  let r;
  try { r = simulateJson(body, seq, opts.data); } catch (err) {
    die(3, `engine failure: ${(err as Error).message}`);
  }
  if (!r.ok) {
    const file = r.which === 'body' ? bodyPath : seqPath;
    die(1, `invalid ${r.which} in '${file}':\n${r.issues.map((i) => `  ${i.path || '(root)'}: ${i.message}`).join('\n')}`);
  }
  process.stdout.write(`${JSON.stringify(r.result)}\n`);
}

main();
