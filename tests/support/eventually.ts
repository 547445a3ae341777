/** Polls `check` until it returns a value (not undefined) or `timeoutMs` runs out (background jobs). */
export async function eventually<T>(check: () => Promise<T | undefined>, timeoutMs = 60_000, everyMs = 250): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await check();
    if (v !== undefined) return v;
    if (Date.now() > until) throw new Error(`condition not met within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}
