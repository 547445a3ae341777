/** Hand-built multipart/form-data bodies, so tests can also send broken ones. */
import * as fc from 'fast-check';

import { hostileText } from './malformed.ts';

/** One part: a text field, or a file. */
export type Part = { name: string; value: string } | { name: string; filename: string; content: Buffer; type?: string };

/** The request body and content type of a well-formed form. */
export function formBody(parts: Part[], boundary = 'fuzzBoundary7MA4YWxk'): { body: Buffer; contentType: string } {
  const chunks: Buffer[] = [];
  for (const p of parts) {
    const head = 'filename' in p
      ? `--${boundary}\r\nContent-Disposition: form-data; name="${p.name}"; filename="${p.filename}"\r\nContent-Type: ${p.type ?? 'text/csv'}\r\n\r\n`
      : `--${boundary}\r\nContent-Disposition: form-data; name="${p.name}"\r\n\r\n`;
    chunks.push(Buffer.from(head), 'filename' in p ? p.content : Buffer.from(p.value), Buffer.from('\r\n'));
  }
  chunks.push(Buffer.from(`--${boundary}--\r\n`));
  return { body: Buffer.concat(chunks), contentType: `multipart/form-data; boundary=${boundary}` };
}

/** A request body with its content type (possibly not multipart at all). */
export interface RawUpload {
  body: Buffer;
  contentType: string;
  what: string;
}

/** Broken CSV text built from a valid one: a row or a cell damaged, the header changed, bytes that are not UTF-8. */
export function brokenCsv(valid: string): fc.Arbitrary<{ text: Buffer; what: string }> {
  const lines = valid.trimEnd().split('\n');
  const header = lines[0].split(',');
  const cell = fc.tuple(fc.integer({ min: 1, max: lines.length - 1 }), fc.integer({ min: 0, max: header.length - 1 }));
  const withCell = (row: number, col: number, value: string) =>
    lines.map((l, i) => (i === row ? l.split(',').map((c, j) => (j === col ? value : c)).join(',') : l)).join('\n') + '\n';
  return fc.oneof(
    fc.tuple(cell, fc.oneof(hostileText.filter((s) => !s.includes('\u0000')), fc.constantFrom('abc', '-5', '1e999', '', '"', '""x', 'NaN', '0x1F'))).map(([[r, c], v]) => ({ text: Buffer.from(withCell(r, c, v)), what: `cell ${r},${c}` })),
    fc.integer({ min: 0, max: header.length - 1 }).map((c) => ({ text: Buffer.from(lines.map((l) => l.split(',').filter((_, j) => j !== c).join(',')).join('\n')), what: `column ${c} dropped` })),
    fc.constantFrom(
      { text: Buffer.from(lines[0] + '\n'), what: 'header only' },
      { text: Buffer.from('\ufeff\n\n\n'), what: 'blank lines' },
      { text: Buffer.concat([Buffer.from(lines[0] + '\n'), Buffer.from([0xff, 0xfe, 0xc3, 0x28, 0x0a])]), what: 'invalid UTF-8' },
      { text: Buffer.from(lines[0] + '\n' + '"unclosed,quote\n'), what: 'unclosed quote' },
      { text: Buffer.from(lines[0] + '\n' + Array.from({ length: 3000 }, () => 'x').join(',') + '\n'), what: '3000 cells' },
      { text: Buffer.from(valid.replaceAll(',', ';')), what: 'semicolons' },
    ),
  );
}

/** Broken uploads of one file field: broken framing, wrong fields, wrong files, and broken contents. */
export function malformedUploads(opts: { fields: Record<string, string>; fileName: string; validFile: string; brokenFiles: fc.Arbitrary<{ text: Buffer; what: string }>; fieldValue?: fc.Arbitrary<unknown> }): fc.Arbitrary<RawUpload> {
  const { fields, fileName, validFile } = opts;
  const fieldParts = (over: Record<string, string> = {}): Part[] => Object.entries({ ...fields, ...over }).map(([name, value]) => ({ name, value }));
  const good = formBody([...fieldParts(), { name: 'file', filename: fileName, content: Buffer.from(validFile) }]);
  const framing: fc.Arbitrary<RawUpload> = fc.oneof(
    fc.integer({ min: 10, max: good.body.length - 8 }).map((cut) => ({ body: good.body.subarray(0, cut), contentType: good.contentType, what: `cut at ${cut}` })),
    fc.constant({ body: good.body, contentType: 'multipart/form-data', what: 'no boundary' }),
    fc.constant({ body: good.body, contentType: 'multipart/form-data; boundary=someOtherBoundary', what: 'wrong boundary' }),
    fc.constant({ body: Buffer.from('--b\r\n\u0001\u0002 junk\r\n\r\n--b--'), contentType: 'multipart/form-data; boundary=b', what: 'junk part headers' }),
    fc.constant({ body: Buffer.from(validFile), contentType: 'text/csv', what: 'not multipart' }),
    fc.constant({ body: Buffer.from(JSON.stringify({ file: validFile })), contentType: 'application/json', what: 'JSON instead of a form' }),
  );
  const form = (parts: Part[], what: string) => ({ ...formBody(parts), what });
  const wrongForms: fc.Arbitrary<RawUpload> = fc.oneof(
    fc.constant(form([...fieldParts(), { name: 'upload', filename: fileName, content: Buffer.from(validFile) }], 'field not "file"')),
    fc.constant(form([...fieldParts(), { name: 'file', filename: fileName, content: Buffer.from(validFile) }, { name: 'file', filename: fileName, content: Buffer.from(validFile) }], 'two files')),
    fc.constant(form([...fieldParts(), { name: 'file', filename: fileName, content: Buffer.alloc(0) }], 'empty file')),
    fc.constant(form([...fieldParts(), { name: 'file', filename: 'crew.exe', content: Buffer.from(validFile) }], 'wrong extension')),
    fc.constant(form([...fieldParts(), { name: 'file', filename: fileName, content: Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x08]) }], 'binary (zip) file')),
    fc.constant(form([...fieldParts(), { name: 'file', filename: fileName, content: Buffer.alloc(1024 * 1024 + 10, 0x41) }], 'over 1 MiB')),
    fc.constant(form(fieldParts(), 'no file')),
    opts.brokenFiles.map(({ text, what }) => form([...fieldParts(), { name: 'file', filename: fileName, content: text }], what)),
  );
  const names = Object.keys(fields);
  if (!names.length) return fc.oneof(framing, wrongForms);
  const badFields: fc.Arbitrary<RawUpload> = fc.tuple(fc.constantFrom(...names), fc.oneof(hostileText, fc.constantFrom('-1', 'abc', '1.5', '', '00000000-0000-0000-0000-000000000000'))).map(([name, value]) =>
    form([...fieldParts({ [name]: value }), { name: 'file', filename: fileName, content: Buffer.from(validFile) }], `field ${name}`));
  return fc.oneof(framing, wrongForms, badFields);
}
