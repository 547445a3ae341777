/**
 * The process's two simulation pools, created with the app context and closed with it. Product work
 * (a trainee's motion, verifying a saved version, a rehearsal recording) and ad-hoc
 * `POST /api/simulate` requests never share a queue or a thread, so however many ad-hoc simulations
 * are waiting, a trainee's motion starts at once on its own pool. Threads start on first use.
 */
import type { Config } from '../../config.ts';
import { SimulationPool } from './simulation-pool.ts';

/** Both pools; `close()` terminates their threads (shutdown). */
export interface SimulationPools {
  /** Motion for the 3D view, version verification, rehearsal recordings. */
  product: SimulationPool;
  /** Ad-hoc simulations from POST /api/simulate (SIMULATE_POOL_SIZE threads). */
  adhoc: SimulationPool;
  close(): Promise<void>;
}

/** Creates both pools with the configured time budget (SIMULATION_TIMEOUT_MS) and ad-hoc size. */
export function createSimulationPools(config: Pick<Config, 'SIMULATION_TIMEOUT_MS' | 'SIMULATE_POOL_SIZE'>): SimulationPools {
  const product = new SimulationPool({ timeoutMs: config.SIMULATION_TIMEOUT_MS });
  const adhoc = new SimulationPool({ size: config.SIMULATE_POOL_SIZE, timeoutMs: config.SIMULATION_TIMEOUT_MS });
  return {
    product,
    adhoc,
    close: async () => { await Promise.all([product.close(), adhoc.close()]); },
  };
}
