import type { z } from 'zod';

/** One problem found in a body or sequence: where (a JSON path such as `segments[3].inertia[1]`) and why, in words. */
export interface ContractIssue {
  /** JSON path of the offending value, e.g. `segments[2].joint.dofs[0].axis` or `steps[4].joints.r_sh_flex`. */
  path: string;
  /** A sentence naming the segment/step, the field and the reason. */
  message: string;
}

/** Outcome of validating a contract: the typed value, or the list of issues (never both). */
export type ContractResult<T> = { ok: true; value: T } | { ok: false; issues: ContractIssue[] };

/** Formats a JSON path array as `a[0].b.c`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out ? `.${String(part)}` : String(part);
  }
  return out;
}

/**
 * Turns zod's issues into contract issues; `describe` adds the owner's name (segment or step) to the message.
 */
export function zodIssuesToContract(
  error: z.ZodError,
  describe: (path: readonly PropertyKey[]) => string,
): ContractIssue[] {
  return error.issues.map((issue) => {
    const path = formatPath(issue.path);
    const owner = describe(issue.path);
    const field = path || '(root)';
    return { path, message: `${owner ? owner + ': ' : ''}${field}: ${issue.message}` };
  });
}
