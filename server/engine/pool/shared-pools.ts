/**
 * The process's two simulation pools. Product work (a trainee's motion, verifying a saved version)
 * and ad-hoc `POST /api/simulate` requests never share a queue or a thread, so however many ad-hoc
 * simulations are waiting, a trainee's motion starts at once on its own pool.
 */
import { SimulationPool } from './simulation-pool.ts';

let product: SimulationPool | null = null;
let adhoc: SimulationPool | null = null;

/** Motion for the 3D view and version verification (created on first use; 20 s budget). */
export function productSimulationPool(): SimulationPool {
  product ??= new SimulationPool({ timeoutMs: 20_000 });
  return product;
}

/** Ad-hoc simulations from POST /api/simulate (created on first use with the configured size and budget). */
export function adhocSimulationPool(opts: { size?: number; timeoutMs?: number } = {}): SimulationPool {
  adhoc ??= new SimulationPool({ size: opts.size ?? 1, timeoutMs: opts.timeoutMs ?? 20_000 });
  return adhoc;
}

/** Closes both pools (shutdown, benchmarks). */
export async function closeSharedPools(): Promise<void> {
  await Promise.all([product?.close(), adhoc?.close()]);
  product = null;
  adhoc = null;
}
