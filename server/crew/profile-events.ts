import type { AppContext } from '../app-context.ts';

/** A crew member's current profile version changed (a save, an import or a measured table). */
export interface ProfileVersionChanged {
  crewMemberId: string;
  /** The new current version's id and number. */
  profileVersionId: string;
  version: number;
  /** The version it replaced as current; null for a member's first version. */
  previousVersionId: string | null;
  /** Who saved it; null for the seed. */
  actorId: string | null;
}

/** A subscriber; runs after the saving transaction committed. */
export type ProfileVersionListener = (ctx: AppContext, event: ProfileVersionChanged) => Promise<void> | void;

// Subscribers in registration order (e.g. the sequences area flags and re-verifies approved versions).
const listeners: ProfileVersionListener[] = [];

/**
 * Subscribe to current-profile changes; returns an unsubscribe function. Sequences register here to
 * flag versions approved against the old profile and enqueue their re-verification.
 */
export function onProfileVersionChanged(listener: ProfileVersionListener): () => void {
  listeners.push(listener);
  return () => {
    const i = listeners.indexOf(listener);
    if (i >= 0) listeners.splice(i, 1);
  };
}

/**
 * Tells every subscriber, after commit. A failing subscriber is logged and does not undo the save
 * (the version is already stored; the subscriber's own job retries are its business).
 */
export async function emitProfileVersionChanged(ctx: AppContext, events: readonly ProfileVersionChanged[]): Promise<void> {
  for (const event of events) {
    for (const listener of [...listeners]) {
      try {
        await listener(ctx, event);
      } catch (err) {
        ctx.logger.error({ err, event }, 'profile version listener failed');
      }
    }
  }
}
