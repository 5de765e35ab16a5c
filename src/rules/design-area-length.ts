// Rule design-area-length: the design area's length parallel to the branch lines must be at least 1.2·√A
// (1.2·√1500 = 46.48 ft).

import { finding, type Rule } from './types.js';

export const designAreaLength: Rule<'design-area-length'> = {
  meta: {
    id: 'design-area-length',
    title: 'Length of the design area along the branch lines',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), 28.2.4.2.1: length parallel to the branch lines ≥ 1.2·√A (confirmed in the handbook)',
  },
  check({ design }) {
    return design.areas.flatMap((a) => {
      const min = a.shape?.minLength;
      if (a.source !== 'drawn' || min === undefined || a.length >= min - 1e-6) return [];
      return [
        finding(this.meta, {
          params: { length: a.length, min },
          handles: a.handle ? [a.handle] : [],
          at: a.at,
          measured: a.length,
          limit: min,
          quantity: 'length',
        }),
      ];
    });
  },
};
