/**
 * fast-check generators of malformed requests: a valid example body with one thing broken (a field
 * dropped, replaced by text the database cannot hold or by a value of the wrong type or range, an
 * unknown field added), a body of the wrong kind, or JSON text cut off mid-way.
 */
import * as fc from 'fast-check';

/** What to send: a JSON value, or raw text with a JSON content type. */
export type Payload = { json: unknown } | { raw: string };

type Path = (string | number)[];

/** Every path to a value inside `v` (objects and arrays walked; the root excluded). */
export function pathsOf(v: unknown, prefix: Path = []): Path[] {
  if (v === null || typeof v !== 'object') return [];
  const entries: [string | number, unknown][] = Array.isArray(v) ? v.map((x, i) => [i, x]) : Object.entries(v);
  return entries.flatMap(([k, x]) => [[...prefix, k], ...pathsOf(x, [...prefix, k])]);
}

function clone<T>(v: T): T {
  return JSON.parse(JSON.stringify(v)) as T;
}

function setAt(root: unknown, path: Path, value: unknown, remove = false): unknown {
  const copy = clone(root);
  let node = copy as Record<string | number, unknown>;
  for (const k of path.slice(0, -1)) node = node[k] as Record<string | number, unknown>;
  const last = path[path.length - 1];
  if (remove) {
    if (Array.isArray(node)) node.splice(Number(last), 1);
    else delete node[last];
  } else node[last] = value;
  return copy;
}

/** Text a server must refuse or store faithfully: NUL, lone surrogates, control characters, very long text. */
export const hostileText: fc.Arbitrary<string> = fc.oneof(
  fc.string({ maxLength: 12 }).map((s) => `${s}\u0000${s}`),
  fc.constantFrom('\ud800', 'a\udc00b', '\udfff\ud800', 'x\ud83d'),
  fc.string({ unit: 'binary', maxLength: 20 }).map((s) => `\u0001\u001b${s}`),
  fc.integer({ min: 5_000, max: 20_000 }).map((n) => 'é'.repeat(n)),
  fc.constantFrom('', ' ', '../../etc/passwd', "'; DROP TABLE users; --", '<script>alert(1)</script>', '%00', '\\u0000'),
);

/** A value of a wrong type or out of any sensible range. */
export const wrongValue: fc.Arbitrary<unknown> = fc.oneof(
  hostileText,
  fc.constantFrom(null, true, false, [], {}, [null], { $gt: '' }),
  fc.constantFrom(-1, 0, 1e308, -1e308, 2 ** 53 + 1, 1e-320, -0.5, 123456789012),
  fc.double({ noNaN: true }),
  fc.array(fc.anything({ maxDepth: 2 }), { maxLength: 4 }),
  fc.letrec((tie) => ({ deep: fc.oneof({ depthSize: 'small' }, fc.constant(1), fc.record({ a: tie('deep') })) })).deep,
);

/** Malformed variants of `valid` (each breaks one thing). */
export function malformedBodies(valid: Record<string, unknown>): fc.Arbitrary<Payload> {
  const paths = pathsOf(valid);
  const broken: fc.Arbitrary<Payload>[] = [
    fc.constantFrom<unknown>(null, [], 'text', 42, true, [valid]).map((json) => ({ json })),
    fc.constantFrom(JSON.stringify(valid)).chain((text) => fc.integer({ min: 1, max: Math.max(1, text.length - 1) }).map((cut) => ({ raw: text.slice(0, cut) }))),
    fc.constantFrom('{"a":', '{,}', "{'single': 'quotes'}", 'null garbage', '{"a":1}{"b":2}', '\u0000').map((raw) => ({ raw })),
    fc.record({ key: fc.oneof(hostileText, fc.constantFrom('__proto__', 'constructor', 'toString')), value: wrongValue }).map(({ key, value }) => ({ json: { ...clone(valid), [key]: value } })),
  ];
  if (paths.length) {
    const path = fc.constantFrom(...paths);
    broken.push(path.map((p) => ({ json: setAt(valid, p, undefined, true) })));
    broken.push(fc.tuple(path, wrongValue).map(([p, v]) => ({ json: setAt(valid, p, v) })));
    broken.push(fc.tuple(path, hostileText).map(([p, v]) => ({ json: setAt(valid, p, v) })));
  }
  return fc.oneof(...broken);
}

/** Malformed query strings: hostile text and wrong shapes for each parameter of a valid query. */
export function malformedQueries(valid: Record<string, string>): fc.Arbitrary<string> {
  const keys = Object.keys(valid);
  const enc = (o: Record<string, string>) => Object.entries(o).map(([k, v]) => `${pctSegment(k)}=${pctSegment(v)}`).join('&');
  return fc.oneof(
    fc.tuple(fc.constantFrom(...keys), hostileText).map(([k, v]) => enc({ ...valid, [k]: v })),
    fc.tuple(fc.constantFrom(...keys), fc.constantFrom('-1', 'NaN', '1e400', '[]', 'true', '0x10', 'null')).map(([k, v]) => enc({ ...valid, [k]: v })),
    fc.constantFrom(...keys).map((k) => `${enc(valid)}&${k}[]=1&${k}[x]=2`),
    fc.constantFrom('%', '%zz', '%00=%00', '&&&=', '%ED%A0%80').map((raw) => `${enc(valid)}&${raw}`),
  );
}

/** Percent-encodes the UTF-8 bytes of a path segment (a URL carries bytes: a lone surrogate arrives as U+FFFD). */
export function pctSegment(s: string): string {
  return [...Buffer.from(s, 'utf8')].map((b) => `%${b.toString(16).padStart(2, '0')}`).join('');
}

/** Ids that look almost right: a UUID cut short, with a letter outside hex, without dashes, numbers. */
const nearMissIds: fc.Arbitrary<string> = fc.uuid().chain((id) => fc.constantFrom(
  id.slice(0, -1), `${id}0`, id.replace(/[0-9a-f]/, 'g'), id.replaceAll('-', ''), `{${id}}`, `${id}/`, `${id}%`, ` ${id}`, '0', '-1', '1e400', 'null', 'undefined',
));

/** Malformed path parameters of a route: one parameter of a valid set replaced by hostile text or a near-miss id. */
export function malformedPathParams(valid: Record<string, string>): fc.Arbitrary<Record<string, string>> {
  const keys = Object.keys(valid);
  return fc.tuple(fc.constantFrom(...keys), fc.oneof(hostileText, nearMissIds))
    .filter(([k, v]) => v !== valid[k])
    .map(([k, v]) => ({ ...valid, [k]: v }));
}
