// The local page in Debian chromium (playwright-core): drop the demo drawing, wait for the verdict, compare
// the page's downloads with what the CLI writes for the same file and config (byte for byte), change the hazard
// and see the result change; path traversal gets 404. A screenshot is kept in test-artifacts/. A dropped DWG loads the
// DWG reader then (not before) from the local server and gives the CLI's bytes too.

import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { expect, it } from 'vitest';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { serve } from '../src/serve/server.js';
import { describeWith, hasCommand, launchChromium } from './support/external.js';
import { headsDrawn } from './support/plan.js';

/** A raw request path, not normalised by a client. */
function statusOf(url: string, rawPath: string): Promise<number> {
  const u = new URL(url);
  return new Promise((res, rej) => {
    const r = request({ host: u.hostname, port: u.port, path: rawPath, method: 'GET' }, (resp) => {
      resp.resume();
      res(resp.statusCode ?? 0);
    });
    r.on('error', rej);
    r.end();
  });
}

describeWith('chromium', hasCommand('chromium'), 'headcheck serve', () => {
  it('checks a dropped drawing in the browser exactly as the CLI does', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'hc-serve-'));
    writeFileSync(join(dir, 'demo-plan.dxf'), demoDrawing());
    const s = await serve(resolve('dist/web'), 0);
    const browser = await launchChromium(join(dir, 'profile'), { width: 1280, height: 1400, downloads: true });
    try {
      expect(await statusOf(s.url, '/../package.json')).toBe(404);
      expect(await statusOf(s.url, '/%2e%2e/%2e%2e/package.json')).toBe(404);
      expect(await statusOf(s.url, '/assets/../../src/cli/main.ts')).toBe(404);
      const page = await browser.newPage();
      const outside: string[] = [];
      page.on('request', (r) => {
        if (!r.url().startsWith(s.url) && !r.url().startsWith('blob:') && !r.url().startsWith('about:')) outside.push(r.url());
      });
      await page.goto(s.url);
      await expect.poll(() => page.locator('#caution').textContent()).toMatch(/authority having jurisdiction/);
      const d = DEMO_CONFIG.design;
      await page.selectOption('select[name=hazard]', d.hazard);
      await page.fill('input[name=density]', String(d.density));
      await page.fill('input[name=area]', String(d.area));
      await page.fill('input[name=static]', String(DEMO_CONFIG.supply.static));
      await page.fill('input[name=residual]', String(DEMO_CONFIG.supply.residual));
      await page.fill('input[name=flow]', String(DEMO_CONFIG.supply.flow));
      await page.fill('input[name=zones]', 'OFFICE*=LH');
      await page.setInputFiles('#file', join(dir, 'demo-plan.dxf'));
      await expect.poll(() => page.locator('#verdict').textContent(), { timeout: 60_000 }).toMatch(/^FAIL: 65 heads/);
      const save = async (id: string, name: string) => {
        const [dl] = await Promise.all([page.waitForEvent('download'), page.click(`#${id}`)]);
        const p = join(dir, name);
        await dl.saveAs(p);
        return readFileSync(p);
      };
      const config = await save('dl-config', 'page.config.json');
      const json = await save('dl-json', 'page.json');
      const dxf = await save('dl-dxf', 'page.dxf');
      const html = await save('dl-html', 'page.html');
      // The CLI on the same file name and config writes the same bytes.
      writeFileSync(join(dir, 'demo-plan.config.json'), config);
      const cli = spawnSync(
        process.execPath,
        [
          resolve('bin/headcheck.js'),
          'check',
          'demo-plan.dxf',
          '--config',
          'demo-plan.config.json',
          '--json',
          'cli.json',
          '--dxf',
          'cli.dxf',
          '--html',
          'cli.html',
        ],
        { cwd: dir, encoding: 'utf8' },
      );
      expect(cli.status).toBe(1);
      expect(json.equals(readFileSync(join(dir, 'cli.json')))).toBe(true);
      expect(dxf.equals(readFileSync(join(dir, 'cli.dxf')))).toBe(true);
      expect(html.equals(readFileSync(join(dir, 'cli.html')))).toBe(true);
      const report = JSON.parse(json.toString('utf8'));
      expect(report.designAreas.map((a: { rank: string | null }) => a.rank)).toEqual([
        null,
        'most-demanding',
        'runner-up',
        'most-demanding',
        'runner-up',
      ]);
      expect(report.zones.map((z: { label: string; hazard: string }) => [z.label, z.hazard])).toEqual([['OFFICE WING', 'LH']]);
      // The report in the page highlights a finding from its row.
      const frame = page.frameLocator('#report');
      expect(await headsDrawn(frame.locator('#plan'))).toBe(65);
      await frame.locator('tr[data-finding="0"]').click();
      await expect.poll(() => frame.locator('#plan circle.marker[data-finding="0"]').getAttribute('class')).toContain('hl');
      mkdirSync('test-artifacts', { recursive: true });
      await page.screenshot({ path: 'test-artifacts/serve-demo.png' });
      // Light hazard allows 225 ft² a head: the two protection-area errors go.
      const errorsBefore = report.summary.errors;
      await page.selectOption('select[name=hazard]', 'LH');
      await expect.poll(() => page.locator('#verdict').textContent(), { timeout: 60_000 }).not.toContain(`${errorsBefore} errors`);
      expect(outside).toEqual([]);
    } finally {
      await browser.close();
      await s.close();
    }
  });
});

const DWG = '../shared/real-dwg/2013_gh44-error.dwg';
describeWith('chromium and ../shared/real-dwg', hasCommand('chromium') && existsSync(DWG), 'headcheck serve with a DWG', () => {
  it('reads a dropped DWG in the page, fetching the reader only then, and writes what the CLI writes', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'hc-serve-dwg-'));
    copyFileSync(DWG, join(dir, 'plan.dwg'));
    const s = await serve(resolve('dist/web'), 0);
    const browser = await launchChromium(join(dir, 'profile'), { width: 1280, height: 1400, downloads: true });
    try {
      const page = await browser.newPage();
      const requests: string[] = [];
      page.on('request', (r) => requests.push(r.url()));
      await page.goto(s.url);
      await expect.poll(() => page.locator('#caution').textContent()).toMatch(/authority having jurisdiction/);
      expect(requests.filter((u) => u.endsWith('.wasm'))).toEqual([]);
      await page.setInputFiles('#file', join(dir, 'plan.dwg'));
      // 38 alike symbols on one layer of this drawing pass for heads (test/real-dwg.test.ts).
      await expect.poll(() => page.locator('#verdict').textContent(), { timeout: 90_000 }).toMatch(/^FAIL: 38 heads/);
      expect(requests.filter((u) => u.endsWith('.wasm'))).toHaveLength(1);
      expect(requests.filter((u) => !u.startsWith(s.url) && !u.startsWith('blob:') && !u.startsWith('about:'))).toEqual([]);
      const save = async (id: string, name: string) => {
        const [dl] = await Promise.all([page.waitForEvent('download'), page.click(`#${id}`)]);
        await dl.saveAs(join(dir, name));
        return readFileSync(join(dir, name));
      };
      writeFileSync(join(dir, 'plan.config.json'), await save('dl-config', 'page.config.json'));
      const json = await save('dl-json', 'page.json');
      const dxf = await save('dl-dxf', 'page.dxf');
      const args = ['check', 'plan.dwg', '--config', 'plan.config.json', '--json', 'cli.json', '--dxf', 'cli.dxf'];
      const cli = spawnSync(process.execPath, [resolve('bin/headcheck.js'), ...args], { cwd: dir, encoding: 'utf8' });
      expect(cli.status, cli.stderr).toBe(1);
      expect(json.equals(readFileSync(join(dir, 'cli.json')))).toBe(true);
      expect(dxf.equals(readFileSync(join(dir, 'cli.dxf')))).toBe(true);
      expect(JSON.parse(json.toString('utf8')).input).toMatchObject({ format: 'dwg', dwgVersion: 'AC1027' });
      // Only the worker's script may make functions from text (LibreDWG's bindings); the page may not.
      const policy = async (path: string) => (await fetch(new URL(path, s.url))).headers.get('content-security-policy') ?? '';
      const worker = requests.find((u) => /\/assets\/check-worker-[\w-]+\.js$/.test(u))!;
      expect(await policy('/')).not.toMatch(/unsafe-eval/);
      expect(await policy(new URL(worker).pathname)).toMatch(/'wasm-unsafe-eval' 'unsafe-eval'/);
    } finally {
      await browser.close();
      await s.close();
    }
  }, 180_000);
});
