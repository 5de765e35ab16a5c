// Rule hydraulics-not-evaluated: a drawing without piping or without a source fed by it is checked for its heads
// only; says why no hydraulic calculation was made (a warning; --require-hydraulics makes it a stop).

import { finding, type Rule } from './types.js';

export const hydraulicsNotEvaluated: Rule<'hydraulics-not-evaluated'> = {
  meta: {
    id: 'hydraulics-not-evaluated',
    title: 'No hydraulic calculation',
    severity: 'warning',
    reference: 'common practice, no source: a layout is calculated once it is piped and fed',
  },
  check({ plan, network }) {
    if (network.systems.length > 0) return [];
    const at = plan.heads[0]?.position ?? { x: 0, y: 0 };
    const params =
      network.pipes.length === 0
        ? ({ kind: 'no-pipes', layers: plan.roles.pipes.layers } as const)
        : plan.sources.length === 0
          ? ({ kind: 'no-source', layers: plan.roles.source.layers } as const)
          : ({ kind: 'source-off-piping', sources: plan.sources.length } as const);
    return [finding(this.meta, { params, handles: plan.sources.map((s) => s.handle), at })];
  },
};
