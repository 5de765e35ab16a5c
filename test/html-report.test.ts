// The HTML report in a real browser (Debian chromium driven by playwright-core): self-contained (no request
// leaves the page), the plan holds every head and a marker per finding, a findings row highlights its
// marker, print hides the controls. A screenshot is kept in test-artifacts/.

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
      expect(await headsDrawn(page.locator('#plan'), '.flowing')).toBe(
        result.design.areas.find((a) => a.rank === 'most-demanding')!.headIds.length,
      );
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
    } finally {
      await browser.close();
    }
  });
});
