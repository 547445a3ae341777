import { useCallback, useMemo, useState } from 'react';

import type { Primitive } from '@/shared/primitives/primitive-schemas';

/** The composer's unsaved step list and the edits it allows. */
export interface ComposerDraft {
  /** Steps in order. */
  steps: Primitive[];
  /** True when `steps` differ from the version they started from. */
  dirty: boolean;
  /** Replace step `i` (or append when `i` equals the length). */
  put: (i: number, step: Primitive) => void;
  /** Move step `i` one place up (-1) or down (+1). */
  move: (i: number, by: -1 | 1) => void;
  remove: (i: number) => void;
  /** Start again from `steps` (a loaded version). */
  reset: (steps: readonly Primitive[]) => void;
  /** Replace every step (e.g. with a planner's suggestion), keeping the draft unsaved. */
  replaceAll: (steps: readonly Primitive[]) => void;
}

/**
 * Local draft of a sequence's steps, started from a saved version's primitives. Saving turns it into
 * a new version on the server; nothing here talks to the API.
 */
export function useComposerDraft(initial: readonly Primitive[]): ComposerDraft {
  const [base, setBase] = useState<readonly Primitive[]>(initial);
  const [steps, setSteps] = useState<Primitive[]>(() => [...initial]);
  const put = useCallback((i: number, step: Primitive) => setSteps((s) => (i >= s.length ? [...s, step] : s.map((x, k) => (k === i ? step : x)))), []);
  const move = useCallback(
    (i: number, by: -1 | 1) =>
      setSteps((s) => {
        const j = i + by;
        if (j < 0 || j >= s.length) return s;
        const next = [...s];
        [next[i], next[j]] = [next[j], next[i]];
        return next;
      }),
    [],
  );
  const remove = useCallback((i: number) => setSteps((s) => s.filter((_, k) => k !== i)), []);
  const reset = useCallback((next: readonly Primitive[]) => {
    setBase(next);
    setSteps([...next]);
  }, []);
  const replaceAll = useCallback((next: readonly Primitive[]) => setSteps([...next]), []);
  const dirty = useMemo(() => JSON.stringify(steps) !== JSON.stringify(base), [steps, base]);
  return { steps, dirty, put, move, remove, reset, replaceAll };
}
