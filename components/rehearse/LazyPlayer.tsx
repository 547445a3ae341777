import type { UseQueryResult } from '@tanstack/react-query';
import { lazy, Suspense } from 'react';
import { StyleSheet, View } from 'react-native';

import { useMotionQuery } from '@/components/api/use-motion';
import { ErrorBanner } from '@/components/ui/ErrorBanner';
import { LoadingState } from '@/components/ui/LoadingState';
import type { PlayerMotion } from '@/shared/contracts/motion';

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
export function LazyPlayer({ versionId, ...rest }: LazyPlayerProps) {
  return <MotionPlayer motion={useMotionQuery(versionId)} {...rest} />;
}

/** Props of {@link MotionPlayer}. */
export interface MotionPlayerProps extends Omit<LazyPlayerProps, 'versionId'> {
  /** The query that fetches the motion (a version's, or a planner suggestion's). */
  motion: UseQueryResult<PlayerMotion>;
}

/** The lazily loaded player for any motion query: loading and error states, then the 3D view. */
export function MotionPlayer({ motion, height, ...player }: MotionPlayerProps) {
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
