/**
 * Admission to the ad-hoc simulation pool: at most `perUser` simulations of one person at a time,
 * and at most `queueMax` waiting for a worker across everyone. A refused request is told when to
 * come back instead of piling up in memory behind the others.
 */
import type { SimulationPool } from './simulation-pool.ts';

/** Why a request was not admitted, and when to retry (seconds). */
export type Refusal = { reason: 'per_user' | 'busy'; retryAfterS: number };

/** Admission limits. */
export interface AdmissionLimits {
  perUser: number;
  queueMax: number;
}

/** Tracks who runs what on one pool. */
export class FairAdmission {
  private inFlight = new Map<string, number>();

  constructor(private readonly pool: SimulationPool, private readonly limits: AdmissionLimits) {}

  /** Admits the user's request or says why not; call `leave` when an admitted request ends. */
  enter(userId: string): Refusal | null {
    const mine = this.inFlight.get(userId) ?? 0;
    // A few seconds is how long a typical in-limit simulation takes here (common practice: retry soon, not at once).
    if (mine >= this.limits.perUser) return { reason: 'per_user', retryAfterS: 5 };
    if (this.pool.queued >= this.limits.queueMax) return { reason: 'busy', retryAfterS: 10 };
    this.inFlight.set(userId, mine + 1);
    return null;
  }

  leave(userId: string): void {
    const mine = (this.inFlight.get(userId) ?? 1) - 1;
    if (mine <= 0) this.inFlight.delete(userId);
    else this.inFlight.set(userId, mine);
  }
}
