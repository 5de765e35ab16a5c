// Counts what the report's plan draws: heads are rings in a few shared paths (one "M" a ring).

import type { Locator } from 'playwright-core';

export async function headsDrawn(plan: Locator, extra = ''): Promise<number> {
  const paths = plan.locator(`path.head${extra}`);
  let n = 0;
  for (const d of await paths.evaluateAll((els) => els.map((e) => e.getAttribute('d') ?? ''))) n += (d.match(/M/g) ?? []).length;
  return n;
}
