// What a rule is: stable id, metadata (title, published reference, severity) and a pure check over the rebuilt
// plan that returns findings as data: the rule's id and its parameters. Their words are in messages.ts, one table.

import type { Zoning } from '../zones/zones.js';
import type { Settings } from '../config/settings.js';
import type { Coverage } from '../coverage/coverage.js';
import type { Walls } from '../coverage/walls.js';
import type { DesignAreas } from '../design-area/evaluate.js';
import type { Point } from '../geometry/point.js';
import type { Network } from '../network/types.js';
import type { Plan } from '../read/plan.js';
import type { DrawingFacts } from '../read/types.js';
import type { FindingParams } from './messages.js';

export type Severity = 'error' | 'warning' | 'info';
/** The physical quantity of a finding's measured/limit values, so reports can convert them. */
export type Quantity = 'length' | 'area' | 'flow' | 'pressure' | 'kFactor' | 'density' | 'count' | 'none';

/** The id of every kind of finding: each rule's, and the note that a rule had more findings than are listed. */
export type FindingKind = keyof FindingParams;

/** A finding as data. Lengths, areas, flows and pressures (in `params`, `measured`, `limit`) are internal US units. */
export interface Finding<K extends FindingKind = FindingKind> {
  rule: K;
  severity: Severity;
  /** What the message says, as data: the rule's own parameters. */
  params: FindingParams[K];
  handles: string[];
  at: Point;
  measured: number | null;
  limit: number | null;
  quantity: Quantity;
  reference: string;
}

export interface RuleMeta<K extends FindingKind = FindingKind> {
  id: K;
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
  /** Hazard zones: each head's design basis and limits (`limitsOf`). */
  zoning: Zoning;
  coverage: Map<string, Coverage>;
  walls: Walls;
  /** Drawn and searched design areas with their hydraulics. */
  design: DesignAreas;
}

export interface Rule<K extends FindingKind = FindingKind> {
  meta: RuleMeta<K>;
  check(ctx: RuleContext): Finding<K>[];
}

/** A finding of the rule `meta` describes, its metadata filled in. */
export function finding<K extends FindingKind>(
  meta: RuleMeta<K>,
  fields: Pick<Finding<K>, 'params' | 'handles' | 'at'> &
    Partial<Pick<Finding<K>, 'severity' | 'measured' | 'limit' | 'quantity' | 'reference'>>,
): Finding<K> {
  return {
    rule: meta.id,
    severity: fields.severity ?? meta.severity,
    reference: fields.reference ?? meta.reference,
    params: fields.params,
    handles: fields.handles,
    at: fields.at,
    measured: fields.measured ?? null,
    limit: fields.limit ?? null,
    quantity: fields.quantity ?? 'none',
  };
}
