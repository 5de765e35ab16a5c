// Every rule, in report order, and the one function that runs them all over a rule context.
// Adding a rule means adding its module and one line here.

import { configUnitsHeader } from './config-units-header.js';
import { configUnitsMixed } from './config-units-mixed.js';
import { designAreaLength } from './design-area-length.js';
import { designAreaMissing } from './design-area-missing.js';
import { designAreaNotRemote } from './design-area-not-remote.js';
import { designAreaSize } from './design-area-size.js';
import { designBasisBelowCurve } from './design-basis-below-curve.js';
import { headDistanceMin } from './head-distance-min.js';
import { headDuplicate } from './head-duplicate.js';
import { headKFactor } from './head-k-factor.js';
import { headOutsideRoom } from './head-outside-room.js';
import { headSpacingMax } from './head-spacing-max.js';
import { headTypeUnchecked } from './head-type-unchecked.js';
import { headUnattached } from './head-unattached.js';
import { hydraulicsNotEvaluated } from './hydraulics-not-evaluated.js';
import { lineSpacingMax } from './line-spacing-max.js';
import { networkDisconnected } from './network-disconnected.js';
import { networkTopology } from './network-topology.js';
import { pipeSizeDefaulted } from './pipe-size-defaulted.js';
import { protectionArea } from './protection-area.js';
import { sourceUnattached } from './source-unattached.js';
import { supplyShort } from './supply-short.js';
import { finding, type Finding, type Rule, type RuleContext } from './types.js';
import { wallDistanceMax } from './wall-distance-max.js';
import { wallDistanceMin } from './wall-distance-min.js';
import { zoneUnmatched } from './zone-unmatched.js';

export const RULES: readonly Rule[] = [
  configUnitsHeader,
  configUnitsMixed,
  designBasisBelowCurve,
  zoneUnmatched,
  hydraulicsNotEvaluated,
  sourceUnattached,
  headUnattached,
  networkDisconnected,
  protectionArea,
  headSpacingMax,
  lineSpacingMax,
  wallDistanceMax,
  wallDistanceMin,
  headDistanceMin,
  headDuplicate,
  headOutsideRoom,
  headTypeUnchecked,
  headKFactor,
  designAreaSize,
  designAreaLength,
  designAreaNotRemote,
  supplyShort,
  designAreaMissing,
  pipeSizeDefaulted,
  networkTopology,
];

/**
 * Findings one rule lists at most; past it the rest are counted in one closing finding (a drawing with thousands
 * of heads too close or out of range is reviewed by its first ones, not by a report of a million lines).
 */
const FINDINGS_PER_RULE = 200;

/** The note that closes a rule's list past FINDINGS_PER_RULE (its severity the worst of what it counts). */
const FINDINGS_NOT_LISTED = {
  id: 'findings-not-listed',
  title: 'Findings not listed',
  severity: 'info',
  reference: 'common practice, no source',
} as const;

export function runRules(ctx: RuleContext, rules: readonly Rule[] = RULES): Finding[] {
  return rules.flatMap((r): Finding[] => {
    const found = r.check(ctx);
    if (found.length <= FINDINGS_PER_RULE) return found;
    const shown = found.slice(0, FINDINGS_PER_RULE);
    const rest = found.slice(FINDINGS_PER_RULE);
    const worst = rest.some((f) => f.severity === 'error') ? 'error' : rest.some((f) => f.severity === 'warning') ? 'warning' : 'info';
    return [
      ...shown,
      finding(FINDINGS_NOT_LISTED, {
        severity: worst,
        params: { rule: r.meta.id, more: rest.length, shown: FINDINGS_PER_RULE },
        handles: [],
        at: rest[0]!.at,
        measured: rest.length,
        quantity: 'count',
      }),
    ];
  });
}
