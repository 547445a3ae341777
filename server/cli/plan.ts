/**
 * `npm run plan -- BODY.json (--yaw Y --pitch P --roll R | --axis X,Y,Z --angle DEG) [options]`:
 * runs the maneuver planner and prints only JSON on stdout: `{ target, candidates, notes }`. Each
 * candidate's `sequence` is a compiled sequence contract that `npm run simulate` accepts as it is.
 * Errors go to stderr naming the flag or field, with a non-zero exit.
 */
import { readFileSync } from 'node:fs';
import { parseArgs, type ParseArgsConfig } from 'node:util';

import { validateBody } from '../../shared/contracts/body.ts';
import { sequenceTargetSchema } from '../../shared/contracts/maneuver.ts';
import { planRequestSchema } from '../../shared/contracts/plan.ts';
import { planManeuver } from '../planning/plan-maneuver.ts';

const HELP = `Usage: npm run plan -- BODY.json --yaw Y --pitch P --roll R [options]
       npm run plan -- BODY.json --axis X,Y,Z --angle DEG [options]

Proposes ranked limb-sweep sequences that turn the body (body contract JSON) to the target
reorientation in free fall, within its joint ranges and the rate limit, and prints JSON on stdout:
{ "target", "candidates": [ { "rank", "primitives", "sequence", "final", "errorDeg", "durationS",
"pathDeg", "netPathDeg", "peakJointRateDegS", "rangeViolations", "robustness", … } ], "notes" }.
A planning and training aid: follow flight rules and certified procedures.

Target (degrees; omitted yaw/pitch/roll are 0):
  --yaw Y --pitch P --roll R   z-y'-x'' angles (yaw −180…180, pitch −90…90, roll −180…180)
  --axis X,Y,Z --angle DEG     rotation about an axis of the initial body frame (angle 0…180)
Options:
  --tolerance DEG     largest acceptable final error (default 2)
  --rate-limit DEG_S  joint rate limit (default 180)
  --time-budget S     longest duration (default: none)
  --candidates N      ranked candidates to return, 1–8 (default 4)
  --samples N         robustness Monte Carlo samples per candidate, 10–1000 (default 100)
  --seed N            seed of the robustness run (default 1)
  -h, --help          show this help

Exit codes: 0 success, 1 invalid body, 2 usage (the message names the flag), 3 planner failure.`;

function die(code: number, message: string): never {
  process.stderr.write(`plan: ${message}\n`);
  process.exit(code);
}

const FLAG_OF: Record<string, string> = {
  yaw: '--yaw', pitch: '--pitch', roll: '--roll', axis: '--axis', angleDeg: '--angle', toleranceDeg: '--tolerance',
  rateLimitDegS: '--rate-limit', timeBudgetS: '--time-budget', maxCandidates: '--candidates', samples: '--samples', seed: '--seed',
};

const options: NonNullable<ParseArgsConfig['options']> = {
  ...Object.fromEntries(['yaw', 'pitch', 'roll', 'axis', 'angle', 'tolerance', 'rate-limit', 'time-budget', 'candidates', 'samples', 'seed'].map((k): [string, { type: 'string' }] => [k, { type: 'string' }])),
  help: { type: 'boolean', short: 'h' },
};

function main(): void {
  let parsed: { values: Record<string, string | boolean | (string | boolean)[] | undefined>; positionals: string[] };
  try {
    parsed = parseArgs({
      allowPositionals: true,
      options,
    });
  } catch (err) {
    die(2, `${(err as Error).message}\n\n${HELP}`);
  }
  // No option is `multiple`: every value is one string or boolean.
  const v = parsed.values as Record<string, string | boolean | undefined>;
  if (v.help) { process.stdout.write(`${HELP}\n`); return; }
  if (parsed.positionals.length !== 1) die(2, `expected one BODY.json (got ${parsed.positionals.length} file arguments)\n\n${HELP}`);
  const num = (name: string): number | undefined => {
    const s = v[name];
    if (s === undefined) return undefined;
    const n = Number(s);
    if (typeof s !== 'string' || s.trim() === '' || !Number.isFinite(n)) die(2, `--${name} must be a number (got '${String(s)}')`);
    return n;
  };
  const usesAxis = v.axis !== undefined || v.angle !== undefined;
  const usesYpr = v.yaw !== undefined || v.pitch !== undefined || v.roll !== undefined;
  if (usesAxis && usesYpr) die(2, 'give either --yaw/--pitch/--roll or --axis with --angle, not both');
  if (!usesAxis && !usesYpr) die(2, 'give a target: --yaw/--pitch/--roll or --axis X,Y,Z with --angle DEG');
  if (usesAxis && (v.axis === undefined || v.angle === undefined)) die(2, v.axis === undefined ? '--angle needs --axis X,Y,Z' : '--axis needs --angle DEG');
  let axis: number[] | undefined;
  if (usesAxis) {
    axis = String(v.axis).split(',').map((x) => Number(x));
    if (axis.length !== 3 || axis.some((x) => !Number.isFinite(x))) die(2, `--axis must be three numbers X,Y,Z (got '${String(v.axis)}')`);
  }
  const limits = { toleranceDeg: num('tolerance'), rateLimitDegS: num('rate-limit'), timeBudgetS: num('time-budget') };
  const targetInput = usesAxis
    ? { mode: 'axis_angle', axisAngle: { axis, angleDeg: num('angle') }, ...limits }
    : { mode: 'ypr', yprDeg: { yaw: num('yaw') ?? 0, pitch: num('pitch') ?? 0, roll: num('roll') ?? 0 }, ...limits };
  const issueText = (issues: { path: PropertyKey[]; message: string }[]) => issues.map((i) => {
    const key = String([...i.path].reverse().find((p) => typeof p === 'string' && FLAG_OF[p]) ?? i.path[i.path.length - 1] ?? '');
    return `${FLAG_OF[key] ?? key}: ${i.message}`;
  }).join('; ');
  const target = sequenceTargetSchema.safeParse(targetInput);
  if (!target.success) die(2, issueText(target.error.issues));
  const settings = planRequestSchema.safeParse({ maxCandidates: num('candidates'), samples: num('samples'), seed: num('seed') });
  if (!settings.success) die(2, issueText(settings.error.issues));

  const path = parsed.positionals[0];
  let json: unknown;
  try { json = JSON.parse(readFileSync(path, 'utf8')); } catch (err) {
    const e = err as NodeJS.ErrnoException;
    die(1, e.code ? `cannot read body file '${path}': ${e.code}` : `body file '${path}' is not valid JSON: ${e.message}`);
  }
  const body = validateBody(json);
  if (!body.ok) die(1, `invalid body in '${path}':\n${body.issues.map((i) => `  ${i.path || '(root)'}: ${i.message}`).join('\n')}`);

  let outcome;
  try { outcome = planManeuver({ body: body.value, target: target.data, settings: settings.data }); } catch (err) {
    die(3, `planner failure: ${(err as Error).message}`);
  }
  process.stdout.write(`${JSON.stringify({ target: target.data, candidates: outcome.candidates, notes: outcome.notes })}\n`);
  if (!outcome.candidates.length) die(3, outcome.notes.join(' ') || 'no candidate found');
}

main();
