/** Loads the engine's test fixtures (bodies and sequences written to the contract). */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

import { type Body, validateBody } from '../../shared/contracts/body.ts';
import { type Sequence, validateSequence } from '../../shared/contracts/sequence.ts';

/** Absolute path of a fixture file. */
export function fixturePath(kind: 'bodies' | 'sequences', name: string): string {
  return fileURLToPath(new URL(`../fixtures/${kind}/${name}.json`, import.meta.url).href);
}

/** A validated body fixture. */
export function loadBody(name: string): Body {
  const r = validateBody(JSON.parse(readFileSync(fixturePath('bodies', name), 'utf8')));
  if (!r.ok) throw new Error(`fixture ${name}: ${r.issues.map((i) => i.message).join('; ')}`);
  return r.value;
}

/** A validated sequence fixture for a body. */
export function loadSequence(name: string, body: Body): Sequence {
  return mustSequence(JSON.parse(readFileSync(fixturePath('sequences', name), 'utf8')), body);
}

/** Validates an inline sequence, throwing with the issues if it is invalid. */
export function mustSequence(json: unknown, body: Body): Sequence {
  const r = validateSequence(json, body);
  if (!r.ok) throw new Error(r.issues.map((i) => i.message).join('; '));
  return r.value;
}

/** Attitude {w,x,y,z} as an array. */
export function quatOf(a: { w: number; x: number; y: number; z: number }): number[] {
  return [a.w, a.x, a.y, a.z];
}
