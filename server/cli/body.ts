/**
 * `npm run body -- --sex female|male --stature METRES --mass KG [--suit NAME] [--lengths FILE.json]
 *  [--biacromial METRES] [--hip-breadth METRES] [--name TEXT]`
 * Prints the derived standard human body as contract JSON on stdout (nothing else); errors go to
 * stderr with a non-zero exit.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';

import { deriveBody, ProfileInputError } from '../model/derive-body.ts';
import { BUILT_IN_SUITS, findBuiltInSuit } from '../model/suits/index.ts';

const USAGE = `Usage: npm run body -- --sex female|male --stature METRES --mass KG [options]

Derives a crew member's body (segment table, body contract JSON) from the standard human model
(de Leva 1996 segment parameters scaled by stature and mass) and prints it on stdout.

Options:
  --sex female|male        which regression table applies (required)
  --stature METRES         stature, 1.2–2.3 m (required)
  --mass KG                body mass without suit or gear, 30–200 kg (required)
  --suit NAME              a shipped suit configuration: ${BUILT_IN_SUITS.map((s) => s.id).join(', ')}
  --lengths FILE.json      measured segment lengths in metres replacing the stature-scaled ones, e.g.
                           {"thigh": 0.43, "shank": 0.44}; keys: head, upperTrunk, middleTrunk,
                           lowerTrunk, upperArm, forearm, hand, thigh, shank, foot, ankleHeight
  --biacromial METRES      biacromial breadth (default: a fraction of stature)
  --hip-breadth METRES     distance between the hip joint centres (default: a fraction of stature)
  --name TEXT              the body's name (default: describes the inputs)
  -h, --help               this text
`;

/** A command-line mistake: message for stderr. */
class UsageError extends Error {}

function number(flag: string, text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const value = Number(text);
  if (text.trim() === '' || !Number.isFinite(value)) throw new UsageError(`--${flag}: "${text}" is not a number`);
  return value;
}

function readLengths(file: string): unknown {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (err) {
    throw new UsageError(`--lengths: cannot read "${file}": ${(err as Error).message}`);
  }
  try {
    return JSON.parse(text);
  } catch (err) {
    throw new UsageError(`--lengths: "${file}" is not valid JSON: ${(err as Error).message}`);
  }
}

/** Maps a profile-input field to the flag that sets it, for error messages. */
function flagFor(field: string): string {
  if (field.startsWith('lengths')) return `--lengths${field.length > 7 ? ` (${field.slice(8)})` : ''}`;
  const flags: Record<string, string> = { sex: '--sex', stature: '--stature', mass: '--mass', biacromialBreadth: '--biacromial', hipBreadth: '--hip-breadth' };
  return flags[field] ?? field;
}

function main(argv: string[]): number {
  let values;
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        sex: { type: 'string' },
        stature: { type: 'string' },
        mass: { type: 'string' },
        suit: { type: 'string' },
        lengths: { type: 'string' },
        biacromial: { type: 'string' },
        'hip-breadth': { type: 'string' },
        name: { type: 'string' },
        help: { type: 'boolean', short: 'h' },
      },
    }));
  } catch (err) {
    process.stderr.write(`body: ${(err as Error).message}\n\n${USAGE}`);
    return 2;
  }
  if (values.help) {
    process.stdout.write(USAGE);
    return 0;
  }
  try {
    for (const flag of ['sex', 'stature', 'mass'] as const) {
      if (values[flag] === undefined) throw new UsageError(`--${flag} is required`);
    }
    if (values.sex !== 'female' && values.sex !== 'male') throw new UsageError(`--sex must be female or male (got "${values.sex}")`);
    const suit = values.suit === undefined ? null : findBuiltInSuit(values.suit);
    if (suit === undefined) {
      throw new UsageError(`--suit: unknown suit "${values.suit}"; shipped suits: ${BUILT_IN_SUITS.map((s) => s.id).join(', ')}`);
    }
    const lengths = values.lengths === undefined ? {} : readLengths(values.lengths);
    const { body } = deriveBody(
      {
        sex: values.sex,
        stature: number('stature', values.stature) as number,
        mass: number('mass', values.mass) as number,
        lengths: lengths as Record<string, number>,
        biacromialBreadth: number('biacromial', values.biacromial),
        hipBreadth: number('hip-breadth', values['hip-breadth']),
        suit,
      },
      values.name === undefined ? {} : { name: values.name },
    );
    process.stdout.write(`${JSON.stringify(body, null, 2)}\n`);
    return 0;
  } catch (err) {
    if (err instanceof UsageError) process.stderr.write(`body: ${err.message}\nRun with --help for usage.\n`);
    else if (err instanceof ProfileInputError) {
      process.stderr.write(`body: ${flagFor(err.field)}: ${err.message.slice(err.field.length + 2)}\n`);
    } else process.stderr.write(`body: ${(err as Error).message}\n`);
    return 1;
  }
}

process.exitCode = main(process.argv.slice(2));
