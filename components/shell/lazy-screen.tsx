import { type ComponentType, lazy, Suspense } from 'react';

import { LoadingState } from '@/components/ui/LoadingState';

/**
 * A screen whose code loads on first visit (a separate chunk on web), so sign-in and the first
 * screen do not download the other screens' code (composer, charts, tables…). `load` imports the
 * module and picks the component; `label` shows while the chunk arrives (null: nothing, for overlays).
 */
export function lazyScreen<P extends object>(load: () => Promise<ComponentType<P>>, label: string | null = 'Loading…'): ComponentType<P> {
  const Lazy = lazy(async () => ({ default: await load() }));
  function LazyScreen(props: P) {
    return (
      <Suspense fallback={label === null ? null : <LoadingState label={label} fill />}>
        <Lazy {...props} />
      </Suspense>
    );
  }
  return LazyScreen;
}
