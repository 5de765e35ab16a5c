// Rule design-area-size: a drawn design area must hold the heads the design area needs: at least
// ceil(A / protection area per head) heads whose S × L add up to at least A (common practice, NFPA 13 handbook).

import { finding, type Rule } from './types.js';

export const designAreaSize: Rule<'design-area-size'> = {
  meta: {
    id: 'design-area-size',
    title: 'Size of the drawn design area',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), 19.3.3: the design area (confirmed); whole heads, rounded up (common practice)',
  },
  check({ design }) {
    return design.areas
      .filter((a) => a.source === 'drawn')
      .flatMap((a) => {
        const need = a.shape?.totalHeads ?? 0;
        const at = a.at;
        const handles = a.handle ? [a.handle] : [];
        if (a.coveredArea < a.basis.area - 1e-6) {
          return [
            finding(this.meta, {
              params: { kind: 'area', area: a.coveredArea, heads: a.headIds.length, required: a.basis.area },
              handles,
              at,
              measured: a.coveredArea,
              limit: a.basis.area,
              quantity: 'area',
            }),
          ];
        }
        if (a.headIds.length < need) {
          return [
            finding(this.meta, {
              params: { kind: 'count', heads: a.headIds.length, required: need },
              handles,
              at,
              measured: a.headIds.length,
              limit: need,
              quantity: 'count',
            }),
          ];
        }
        return [];
      });
  },
};
