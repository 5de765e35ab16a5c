// Rule head-type-unchecked: sidewall, extended-coverage and other special heads have listed limits,
// not the standard-spray table, so their spacing is not checked here; the reviewer is told (info).

import { finding, type Rule } from './types.js';

export const headTypeUnchecked: Rule = {
  meta: {
    id: 'head-type-unchecked', title: 'Special head not checked against the standard-spray table', severity: 'info',
    reference: 'NFPA 13 (2019 edition), Chapters 11-12: listed heads follow their listing (from memory)',
  },
  check({ plan }) {
    return plan.heads
      .filter((h) => h.kind !== 'standard')
      .map((h) => finding(this.meta, {
        message: `head ${h.id} is ${h.kind === 'other' ? `of type "${h.attributes['TYPE'] ?? h.attributes['HEADTYPE']}"` : h.kind}: check its spacing against its listing`,
        handles: [h.handle], at: h.position,
      }));
  },
};
