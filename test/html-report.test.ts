// The HTML report in a real browser (Debian chromium driven by playwright-core): self-contained (no request
// leaves the page), the plan holds every head and a marker per finding, a findings row highlights its marker, the
// legend names every kind of outline drawn and prints, the supply graph's labels do not overprint, print hides the
// controls. Screenshots (screen and print) are kept in test-artifacts/.

import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { FORMATS } from '../src/check/formats.js';
import { runCheck } from '../src/check/run-check.js';
import { parseSettings } from '../src/config/settings.js';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { describeWith, hasCommand, launchChromium } from './support/external.js';
import { headsDrawn } from './support/plan.js';

describeWith('chromium', hasCommand('chromium'), 'HTML report in Chromium', () => {
  it('shows the plan, highlights a finding from its row, and loads nothing from outside', async () => {
    const input = {
      bytes: new TextEncoder().encode(demoDrawing()),
      fileName: 'demo-plan.dxf',
      sha256: '',
      settings: parseSettings(DEMO_CONFIG),
      reportUnits: 'us' as const,
    };
    const result = runCheck(input);
    const dir = mkdtempSync(join(tmpdir(), 'hc-html-'));
    const file = join(dir, 'report.html');
    writeFileSync(file, FORMATS.html.make(result));
    const browser = await launchChromium(join(dir, 'profile'), { width: 1200, height: 1600 });
    try {
      const page = await browser.newPage();
      const requests: string[] = [];
      page.on('request', (r) => requests.push(r.url()));
      await page.goto(`file://${file}`);
      expect(await headsDrawn(page.locator('#plan'))).toBe(result.plan.heads.length);
      expect(await page.locator('#plan circle.marker').count()).toBe(result.findings.length);
      // the heads of each system's most demanding area flow
      expect(await headsDrawn(page.locator('#plan'), '.flowing')).toBe(
        result.design.areas.filter((a) => a.rank === 'most-demanding').reduce((n, a) => n + a.headIds.length, 0),
      );
      // every kind of outline the plan draws has its legend entry
      const kinds = await page
        .locator('#plan path.room, #plan path.zone, #plan path.area')
        .evaluateAll((els) =>
          [...new Set(els.map((e) => [...e.classList].find((c) => c === 'room' || c === 'zone' || c.startsWith('area-'))!))].sort(),
        );
      expect(kinds).toEqual(['area-drawn', 'area-most-demanding', 'area-runner-up', 'room', 'zone']);
      const keys = await page.locator('.key [data-key]').evaluateAll((els) => els.map((e) => e.getAttribute('data-key')));
      for (const kind of kinds) expect(keys).toContain(kind);
      // the supply graph's demand labels do not overprint each other
      const boxes = await page.locator('#supply text.demand-label').evaluateAll((els) =>
        els.map((e) => {
          const b = e.getBoundingClientRect();
          return [b.left, b.top, b.right, b.bottom];
        }),
      );
      expect(boxes.length).toBe(result.design.areas.length);
      for (const [i, a] of boxes.entries())
        for (const b of boxes.slice(i + 1)) expect(a[0]! < b[2]! && b[0]! < a[2]! && a[1]! < b[3]! && b[1]! < a[3]!).toBe(false);
      // the calculation of every calculated area is there, and its step table adds up on the page as in the report
      expect(await page.locator('details.calc').count()).toBe(result.design.areas.filter((a) => a.hydraulics).length);
      const row = page.locator('tr[data-finding="0"]');
      await row.click();
      await expect.poll(() => page.locator('#plan circle.marker[data-finding="0"]').getAttribute('class')).toContain('hl');
      expect(await row.getAttribute('class')).toContain('hl');
      expect(await page.locator('#supply line.supply').count()).toBe(1);
      expect(await page.locator('#supply circle.demand').count()).toBe(2 * result.design.areas.length);
      expect(requests.every((u) => u.startsWith('file://'))).toBe(true);
      mkdirSync('test-artifacts', { recursive: true });
      await page.screenshot({ path: 'test-artifacts/report-demo.png', fullPage: false });
      await page.emulateMedia({ media: 'print' });
      expect(await page.locator('.tools').isVisible()).toBe(false);
      // the legend's swatches are drawn, so print keeps them
      expect(await page.locator('.key svg').count()).toBe(keys.length);
      expect(await page.locator('.key').isVisible()).toBe(true);
      await page.screenshot({ path: 'test-artifacts/report-demo-print.png', fullPage: true });
    } finally {
      await browser.close();
    }
  });
});
