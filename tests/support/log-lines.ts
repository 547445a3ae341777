/**
 * The server's log as written, for tests that check what is logged: pass `destination` as the test
 * app's `logDestination`; every line lands in `lines`.
 */
import { Writable } from 'node:stream';

export function logLines(): { lines: string[]; destination: Writable } {
  const lines: string[] = [];
  const destination = new Writable({
    write(chunk, _enc, done) {
      lines.push(String(chunk));
      done();
    },
  });
  return { lines, destination };
}
