import { lazy, Suspense } from 'react';
import { StyleSheet, View } from 'react-native';

import { useMotionQuery } from '@/components/api/use-motion';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';

import type { RehearsalPlayerProps } from './RehearsalPlayer';

// three, fiber and drei load only when a player is shown (a separate chunk on web).
const RehearsalPlayer = lazy(() => import('./RehearsalPlayer'));

/** Props of {@link LazyPlayer}. */
export interface LazyPlayerProps extends Omit<RehearsalPlayerProps, 'motion'> {
  /** The sequence version to play. */
  versionId: string;
  /** Height when embedded (e.g. 480 as a report preview); default: fill the parent. */
  height?: number;
}

/**
 * The 3D rehearsal player, loaded on demand: fetches the version's motion (once, cached) and shows a
 * loading state while the 3D code and samples arrive. Use it anywhere a 3D preview is wanted.
 */
export function LazyPlayer({ versionId, height, ...player }: LazyPlayerProps) {
  const motion = useMotionQuery(versionId);
  const box = height ? { height } : styles.fill;
  if (motion.isPending) return <View style={[box, styles.center]}><LoadingState label="Computing the motion…" /></View>;
  if (motion.isError) return <View style={[box, styles.center]}><ErrorBanner title="Could not load the motion" error={motion.error} onRetry={() => void motion.refetch()} /></View>;
  return (
    <View style={box}>
      <Suspense fallback={<View style={[styles.fill, styles.center]}><LoadingState label="Loading the 3D view…" /></View>}>
        <RehearsalPlayer motion={motion.data} {...player} />
      </Suspense>
    </View>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1 },
  center: { alignItems: 'center', justifyContent: 'center', padding: 16 },
});
