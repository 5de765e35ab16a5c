// A finding's measured value and limit as every output shows them: in the report's units, rounded by the one
// formatter, with the handles' head ids where the finding names heads.

import type { Formatter } from '../quantities/format.js';
import type { Finding } from '../rules/types.js';

/** A value of the finding's quantity, with its unit ('' for none). */
export function valueText(f: Pick<Finding, 'quantity'>, v: number | null, fmt: Formatter): string {
  if (v === null) return '';
  switch (f.quantity) {
    case 'length':
      return fmt.length(v);
    case 'area':
      return fmt.area(v);
    case 'pressure':
      return fmt.pressure(v);
    case 'flow':
      return fmt.flow(v);
    case 'kFactor':
      return fmt.kFactor(v);
    case 'density':
      return fmt.density(v);
    default:
      return String(Math.round(v * 100) / 100);
  }
}

/** "4.00 ft (limit 6.00 ft)", or '' where the finding has no measured value and limit. */
export function measuredText(f: Finding, fmt: Formatter): string {
  return f.measured !== null && f.limit !== null ? `${valueText(f, f.measured, fmt)} (limit ${valueText(f, f.limit, fmt)})` : '';
}

/** The head ids a finding's parameters name (`head`, `next`, `heads`), in order, each once. */
export function headsNamed(f: Finding): string[] {
  const p = f.params as { head?: unknown; next?: unknown; heads?: unknown };
  const ids = [p.head, p.next, ...(Array.isArray(p.heads) ? p.heads : [])].filter(
    (x): x is string => typeof x === 'string' && /^H\d+$/.test(x),
  );
  return [...new Set(ids)];
}
