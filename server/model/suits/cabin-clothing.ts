import type { SuitConfigInput } from '../../../shared/contracts/suit.ts';
import { sameOnBothSides } from '../../../shared/model/body-sides.ts';

/**
 * In-cabin clothing (shirt, trousers, socks, soft shoes). ILLUSTRATIVE values: masses are rough
 * garment weights placed at each segment's CoM as point masses; ranges are unchanged.
 */
export const CABIN_CLOTHING = {
  id: 'cabin-clothing',
  name: 'In-cabin clothing',
  illustrative: true,
  note:
    'Illustrative values, not measured: about 1.5 kg of garments spread over the segments as point masses at each segment CoM. ' +
    'Clothing does not restrict the joints here, so the unsuited ranges apply.',
  segments: {
    upper_trunk: { mass: 0.45 },
    lower_trunk: { mass: 0.25 },
    ...sameOnBothSides({
      upper_arm: { mass: 0.05 },
      forearm: { mass: 0.03 },
      thigh: { mass: 0.12 },
      shank: { mass: 0.08 },
      foot: { mass: 0.1 },
    }),
  },
  ranges: {},
  lockedDofs: [],
} satisfies SuitConfigInput;
