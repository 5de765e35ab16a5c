// Rule head-k-factor: a head whose K-factor lies outside the range of listed sprinklers is an error, since every
// flow of the calculation follows from it (most often a K attribute read in the other unit system). Heads with one
// wrong K are one finding naming every head, not one each.

import { KSI_PER_KUS } from '../quantities/convert.js';
import type { Head } from '../read/plan.js';
import { finding, type Rule } from './types.js';

/**
 * K-factors of listed sprinklers, gpm/psi½: from the range of nominal K 1.4 (1.3 to 1.5) to that of nominal K 33.6
 * (31.8 to 34.8) (NFPA 13 (2019 edition), Table 7.2.2.1, from memory).
 */
const LISTED_K_RANGE = { min: 1.3, max: 34.8 } as const;

export const headKFactor: Rule<'head-k-factor'> = {
  meta: {
    id: 'head-k-factor',
    title: 'Head K-factor outside the range of listed sprinklers',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), Table 7.2.2.1: K-factors 1.3 to 34.8 gpm/psi½, nominal K 1.4 to 33.6 (from memory)',
  },
  check({ plan, settings }) {
    const { min, max } = LISTED_K_RANGE;
    const inRange = (k: number) => k >= min && k <= max;
    // Only a K attribute can be out of range: the config's default is checked with the config.
    const byValue = new Map<string, Head[]>();
    for (const h of plan.heads) {
      if (inRange(h.kFactor)) continue;
      const key = h.attributes['K'] ?? String(h.kFactor);
      byValue.set(key, [...(byValue.get(key) ?? []), h]);
    }
    const si = settings.unitSystem === 'si';
    return [...byValue.entries()].map(([attribute, heads]) => {
      const k = heads[0]!.kFactor;
      // Read in the other unit system, would the value be a listed K? Then that is the likely mix-up.
      const other = si ? k * KSI_PER_KUS : k / KSI_PER_KUS;
      return finding(this.meta, {
        params: {
          heads: heads.map((h) => h.id),
          k,
          attribute,
          system: settings.unitSystem,
          min,
          max,
          looksLike: inRange(other) ? (si ? 'gpm/psi½' : 'L/min/bar½') : null,
        },
        handles: heads.map((h) => h.handle),
        at: heads[0]!.position,
        measured: k,
        limit: k < min ? min : max,
        quantity: 'kFactor',
      });
    });
  },
};
