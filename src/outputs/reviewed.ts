// A drawing as the outputs see it once checked: what was read, rebuilt, measured and found, with the report and
// the choices the check was made with. Every output is a function of this alone.

import type { Zoning } from '../zones/zones.js';
import type { Settings } from '../config/settings.js';
import type { Coverage } from '../coverage/coverage.js';
import type { DesignAreas } from '../design-area/evaluate.js';
import type { Network } from '../network/types.js';
import type { UnitSystem } from '../quantities/convert.js';
import type { Plan } from '../read/plan.js';
import type { DrawingFacts } from '../read/types.js';
import type { Finding } from '../rules/types.js';
import type { Report } from './json-report.js';

export interface Reviewed {
  /** The drawing's bytes (the annotated drawing is made of them) and its name as the report states it. */
  bytes: Uint8Array;
  fileName: string;
  settings: Settings;
  reportUnits: UnitSystem;
  /** The drawing's facts; its raw geometry is let go once the plan holds what the stages use. */
  drawing: DrawingFacts;
  plan: Plan;
  network: Network;
  coverage: Map<string, Coverage>;
  /** Hazard zones, and the design basis and limits of each head. */
  zoning: Zoning;
  design: DesignAreas;
  findings: Finding[];
  report: Report;
}
