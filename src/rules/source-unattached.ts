// Rule source-unattached: a water source symbol on no pipe feeds nothing (an error); a second source on the
// piping of another is calculated as one system from the first (a warning: the tool does not share the flow).

import { SOURCE_REACH_FT } from '../network/build-network.js';
import { finding, type Finding, type Rule } from './types.js';

export const sourceUnattached: Rule<'source-unattached'> = {
  meta: {
    id: 'source-unattached',
    title: 'Water source on no pipe',
    severity: 'error',
    reference: 'common practice, no source: the system is fed from its riser',
  },
  check({ plan, network }) {
    // A layout without any piping yet is no error of its riser (hydraulics-not-evaluated says so).
    if (network.pipes.length === 0) return [];
    const off = new Set(network.unattachedSourceHandles);
    const out: Finding<'source-unattached'>[] = plan.sources
      .filter((s) => off.has(s.handle))
      .map((s) => finding(this.meta, { params: { kind: 'off-piping', reach: SOURCE_REACH_FT }, handles: [s.handle], at: s.position }));
    for (const system of network.systems) {
      for (const handle of system.sharedSourceHandles) {
        const s = plan.sources.find((x) => x.handle === handle)!;
        out.push(
          finding(this.meta, { severity: 'warning', params: { kind: 'shared', system: system.id }, handles: [handle], at: s.position }),
        );
      }
    }
    return out;
  },
};
