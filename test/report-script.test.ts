// The HTML report's script is a typed module (src/outputs/report-script/plan-view.ts) bundled by Vite; the module
// the report inlines (report-script.generated.ts) must be what that bundle gives today.

import { readFileSync } from 'node:fs';
import { build, type Rollup } from 'vite';
import { expect, it } from 'vitest';
import { GENERATED, moduleOf, REPORT_BUILD } from '../vite.report.config.js';

it('the inlined report script is the bundle of its typed source (run npm run build after changing it)', async () => {
  const out = (await build({ configFile: false, logLevel: 'silent', build: { ...REPORT_BUILD, write: false } })) as Rollup.RollupOutput[];
  const chunk = out[0]!.output.find((o): o is Rollup.OutputChunk => o.type === 'chunk')!;
  expect(readFileSync(GENERATED, 'utf8')).toBe(moduleOf(chunk.code));
});
