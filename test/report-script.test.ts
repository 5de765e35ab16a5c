// The HTML report's script is a typed module (src/outputs/report-script/plan-view.ts) bundled by Vite; the module
// the report inlines (report-script.generated.ts) must be what that bundle gives today.

import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { build, type Rollup } from 'vite';
import { expect, it } from 'vitest';
import { REPORT_SCRIPT, REPORT_SCRIPT_SHA256 } from '../src/outputs/report-script.generated.js';
import { GENERATED, moduleOf, REPORT_BUILD } from '../vite.report.config.js';

it('the inlined report script is the bundle of its typed source (run npm run build after changing it)', async () => {
  const out = (await build({ configFile: false, logLevel: 'silent', build: { ...REPORT_BUILD, write: false } })) as Rollup.RollupOutput[];
  const chunk = out[0]!.output.find((o): o is Rollup.OutputChunk => o.type === 'chunk')!;
  expect(readFileSync(GENERATED, 'utf8')).toBe(moduleOf(chunk.code));
});

it("the script's hash the report's Content-Security-Policy names is the SHA-256 of its UTF-8 bytes", () => {
  // The reference: Node's OpenSSL digest, and a browser would refuse the script on any other (Chromium runs it in
  // the html-report tests). FIPS 180-4's example "abc" holds the reference to the standard. Common practice.
  const digest = (text: string) => createHash('sha256').update(text, 'utf8').digest();
  expect(digest('abc').toString('hex')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'); // FIPS 180-4, example "abc"
  expect(REPORT_SCRIPT_SHA256).toBe(digest(REPORT_SCRIPT).toString('base64'));
});
