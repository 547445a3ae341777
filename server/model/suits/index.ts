import { type SuitConfig, suitConfigSchema } from '../../../shared/contracts/suit.ts';
import { CABIN_CLOTHING } from './cabin-clothing.ts';
import { PRESSURISED_SUIT } from './pressurised-suit.ts';

/** The shipped suit configurations (all illustrative), validated; the seed and the CLI use them. */
export const BUILT_IN_SUITS: readonly SuitConfig[] = [CABIN_CLOTHING, PRESSURISED_SUIT].map((s) => suitConfigSchema.parse(s));

/** A shipped suit configuration by id, or undefined. */
export function findBuiltInSuit(id: string): SuitConfig | undefined {
  return BUILT_IN_SUITS.find((s) => s.id === id);
}
