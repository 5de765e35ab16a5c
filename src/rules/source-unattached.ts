// Rule source-unattached: the water source symbol is on no pipe, so nothing is fed and no hydraulic calculation
// can run. An error.

import { SOURCE_REACH_FT } from '../network/build-network.js';
import { finding, type Rule } from './types.js';

export const sourceUnattached: Rule<'source-unattached'> = {
  meta: {
    id: 'source-unattached',
    title: 'Water source on no pipe',
    severity: 'error',
    reference: 'common practice, no source: the system is fed from its riser',
  },
  check({ plan, network }) {
    if (network.sourceNodeId || plan.sources.length === 0) return [];
    const s = plan.sources[0]!;
    return [finding(this.meta, { params: { reach: SOURCE_REACH_FT }, handles: [s.handle], at: s.position })];
  },
};
