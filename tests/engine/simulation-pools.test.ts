/**
 * The simulation pools belong to the app context: made from configuration (SIMULATION_TIMEOUT_MS,
 * SIMULATE_POOL_SIZE) when the context is created, and closed with it.
 */
import { describe, expect, it } from 'vitest';

import { createSimulationPools } from '../../server/engine/pool/simulation-pools.ts';
import { loadBody, loadSequence } from './fixtures.ts';

describe('createSimulationPools', () => {
  it('uses the configured time budget for both pools and the configured size for the ad-hoc one', async () => {
    const pools = createSimulationPools({ SIMULATION_TIMEOUT_MS: 1234, SIMULATE_POOL_SIZE: 3 });
    expect(pools.product.timeoutMs).toBe(1234);
    expect(pools.adhoc.timeoutMs).toBe(1234);
    expect(pools.adhoc.size).toBe(3);
    expect(pools.product).not.toBe(pools.adhoc);
    await pools.close();
  });

  it('runs a simulation, and after close() refuses new work with a clear error', async () => {
    const pools = createSimulationPools({ SIMULATION_TIMEOUT_MS: 30_000, SIMULATE_POOL_SIZE: 1 });
    const body = loadBody('arm-on-trunk');
    const reply = await pools.product.run(body, loadSequence('arm-cone', body), { rateHz: 5 });
    expect(reply.kind).toBe('result');
    await pools.close();
    await expect(pools.product.run(body, { steps: [] })).rejects.toThrow(/simulation pool is closed/);
    await expect(pools.adhoc.run(body, { steps: [] })).rejects.toThrow(/simulation pool is closed/);
  });
});
