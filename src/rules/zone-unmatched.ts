// Rule zone-unmatched: a hazard zone whose label matches no pattern of the config's `zones` (or that holds no
// label) is checked against the configured `design` instead: a warning, since its hazard may be another.

import { finding, type Rule } from './types.js';

export const zoneUnmatched: Rule<'zone-unmatched'> = {
  meta: {
    id: 'zone-unmatched',
    title: 'Hazard zone without a design basis',
    severity: 'warning',
    reference: 'common practice, no source: each hazard is designed on its own basis',
  },
  check({ zoning }) {
    return zoning.zones
      .filter((z) => z.pattern === null)
      .map((z) =>
        finding(this.meta, {
          params: { zone: z.id, label: z.label, heads: z.headIds.length, hazard: z.hazard },
          handles: [z.handle],
          at: z.outline[0]!,
          measured: z.headIds.length,
          quantity: 'count',
        }),
      );
  },
};
