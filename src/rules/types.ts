// What a rule is: stable id, metadata (title, published reference, severity) and a pure check over the
// rebuilt plan. A finding's measured and limit values are internal units, named by `quantity`.

import type { Settings } from '../config/settings.js';
import type { DesignAreas } from '../design-area/evaluate.js';
import type { Point } from '../geometry/point.js';
import type { Network } from '../network/types.js';
import type { Plan } from '../read/plan.js';
import type { DrawingFacts } from '../read/types.js';
import type { Formatter } from '../quantities/format.js';
import type { Coverage } from '../coverage/coverage.js';
import type { Limits } from '../basis/limits.js';
import type { Walls } from '../coverage/walls.js';

export type Severity = 'error' | 'warning' | 'info';
/** The physical quantity of a finding's measured/limit values, so reports can convert them. */
export type Quantity = 'length' | 'area' | 'flow' | 'pressure' | 'kFactor' | 'density' | 'count' | 'none';

export interface Finding {
  rule: string;
  severity: Severity;
  message: string;
  handles: string[];
  at: Point;
  measured: number | null;
  limit: number | null;
  quantity: Quantity;
  reference: string;
}

export interface RuleMeta {
  id: string;
  title: string;
  severity: Severity;
  /** The published rule, with edition, or "common practice, no source". */
  reference: string;
}

export interface RuleContext {
  /** What the drawing says of itself (version, units, header). */
  drawing: DrawingFacts;
  plan: Plan;
  network: Network;
  settings: Settings;
  limits: Limits;
  coverage: Map<string, Coverage>;
  walls: Walls;
  /** Drawn and searched design areas with their hydraulics. */
  design: DesignAreas;
  /** Formats values in the report's units for messages. */
  fmt: Formatter;
}

export interface Rule {
  meta: RuleMeta;
  check(ctx: RuleContext): Finding[];
}

/** A finding of `rule` with its metadata filled in. */
export function finding(
  meta: RuleMeta,
  fields: Omit<Finding, 'rule' | 'severity' | 'reference' | 'measured' | 'limit' | 'quantity'> &
    Partial<Pick<Finding, 'severity' | 'measured' | 'limit' | 'quantity' | 'reference'>>,
): Finding {
  return {
    rule: meta.id, severity: fields.severity ?? meta.severity, reference: fields.reference ?? meta.reference,
    measured: fields.measured ?? null, limit: fields.limit ?? null, quantity: fields.quantity ?? 'none',
    message: fields.message, handles: fields.handles, at: fields.at,
  };
}
