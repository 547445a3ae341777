import { afterAll, beforeAll } from 'vitest';

/**
 * Errors that escape to the process (uncaught exceptions, unhandled rejections) while the test file
 * runs. Fault tests expect none: a fault must reach the caller as an answer, never crash the server.
 * Call it before starting what is under test, so that its listeners cover the whole run.
 */
export function recordUncaughtErrors(): readonly unknown[] {
  const uncaught: unknown[] = [];
  const record = (err: unknown) => uncaught.push(err);
  beforeAll(() => {
    process.on('uncaughtException', record);
    process.on('unhandledRejection', record);
  });
  afterAll(() => {
    process.off('uncaughtException', record);
    process.off('unhandledRejection', record);
  });
  return uncaught;
}
