// Rule head-k-factor: a head whose K-factor lies outside the range of listed sprinklers is an error, since
// every flow of the calculation follows from it (most often a K attribute read in the other unit system).

import { finding, type Rule } from './types.js';

/**
 * K-factors of listed sprinklers, gpm/psi½: from the range of nominal K 1.4 (1.3 to 1.5) to that of nominal K 33.6
 * (31.8 to 34.8) (NFPA 13 (2019 edition), Table 7.2.2.1, from memory).
 */
export const LISTED_K_RANGE = { min: 1.3, max: 34.8 } as const;

export const headKFactor: Rule = {
  meta: {
    id: 'head-k-factor', title: 'Head K-factor outside the range of listed sprinklers', severity: 'error',
    reference: 'NFPA 13 (2019 edition), Table 7.2.2.1: K-factors 1.3 to 34.8 gpm/psi½, nominal K 1.4 to 33.6 (from memory)',
  },
  check({ plan, settings, fmt }) {
    const { min, max } = LISTED_K_RANGE;
    const unit = settings.unitSystem === 'si' ? 'L/min/bar½, as the config is SI' : 'gpm/psi½, as the config is US';
    return plan.heads
      .filter((h) => !(h.kFactor >= min && h.kFactor <= max))
      .map((h) => {
        // Only a K attribute can be out of range: the config's default is checked with the config.
        const limit = h.kFactor < min ? min : max;
        const cause = `its K attribute "${h.attributes['K']}" is read in ${unit}`;
        return finding(this.meta, {
          message: `head ${h.id} has ${fmt.kFactor(h.kFactor)}, outside the listed ${fmt.kFactor(min)} to ${fmt.kFactor(max)} (${cause}): check the head and the unit`,
          handles: [h.handle], at: h.position, measured: h.kFactor, limit, quantity: 'kFactor',
        });
      });
  },
};
