// Hostile drawings (src/demo/hostile.ts): blocks that multiply into millions of entities end in one line naming the
// block and the count, before anything is expanded; a field of ten thousand heads packed together ends in a report
// of bounded size; a wall of 130,000 vertices is drawn; a 600 MB file is refused by its size without being read.

import { closeSync, mkdtempSync, openSync, readFileSync, writeFileSync, ftruncateSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../src/cli/main.js';
import { HOSTILE } from '../src/demo/hostile.js';

const dir = mkdtempSync(join(tmpdir(), 'hc-hostile-'));
async function check(name: string, ...extra: string[]) {
  const file = join(dir, `${name}.dxf`);
  writeFileSync(file, HOSTILE[name]!.dxf());
  const err: string[] = [];
  const out: string[] = [];
  const code = await main(['node', 'headcheck', 'check', file, '--no-config', ...extra], {
    out: (s) => out.push(s),
    err: (s) => err.push(s),
  });
  return { code, err: err.join('\n'), out: out.join('\n') };
}

describe('blocks that multiply', () => {
  it.each([
    [
      'polyline-block-array',
      /expand to 10000005 entities, over the limit of 1000000 \(inputLimits\.expandedEntities\): block "TILE" placed 1000000 times by one array on layer "A-WALL"/,
    ],
    [
      'nested-fan-out',
      /expand to 211111115 entities, over the limit of 1000000 \(inputLimits\.expandedEntities\): block "L0" on layer "FP-PIPE" expands to 211111111 entities/,
    ],
    ['head-array-1000', /layer "FP-HEAD" places block "HEAD" 1000000 times, over the limit of 100000 heads \(inputLimits\.heads\)/],
  ])('%s: exit 2, one line naming the block and the count', async (name, message) => {
    const r = await check(name);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')).toHaveLength(1);
    expect(r.err).toMatch(message);
  });
});

describe('large but legal', () => {
  it('ten thousand heads packed 6 in apart: a report, one finding per cluster, no rule past 200 findings', async () => {
    const json = join(dir, 'packed.json');
    const r = await check('head-array-100', '--json', json);
    expect(r.code).toBe(1);
    const report = JSON.parse(readFileSync(json, 'utf8'));
    expect(report.summary.heads).toBe(10_000);
    const byRule = new Map<string, number>();
    for (const f of report.findings) byRule.set(f.rule, (byRule.get(f.rule) ?? 0) + 1);
    for (const n of byRule.values()) expect(n).toBeLessThanOrEqual(201);
    // every head is within 6 ft of its neighbours: one cluster holding all of them
    const close = report.findings.filter((f: { rule: string }) => f.rule === 'head-distance-min');
    expect(close).toHaveLength(1);
    expect(close[0].handles).toHaveLength(1); // all copies of one MINSERT share its handle
    expect(close[0].message).toMatch(/^10000 heads stand closer than 6\.00 ft to one another/);
  });

  it('a wall of 130,000 vertices: checked, the report page drawn', async () => {
    const html = join(dir, 'wall.html');
    const r = await check('long-wall', '--html', html);
    expect([0, 1]).toContain(r.code);
    expect(readFileSync(html, 'utf8').length).toBeGreaterThan(1_000_000);
  });
});

describe('a file past the size limit', () => {
  it('600 MB is refused by its size, before it is read (a sparse file: nothing to read would fit the time)', async () => {
    const file = join(dir, 'huge.dxf');
    const fd = openSync(file, 'w');
    ftruncateSync(fd, 600 * 1024 * 1024);
    closeSync(fd);
    const before = process.memoryUsage().rss;
    const err: string[] = [];
    const code = await main(['node', 'headcheck', 'check', file, '--no-config'], { out: () => undefined, err: (s) => err.push(s) });
    expect(code).toBe(2);
    expect(err).toEqual([`headcheck: ${file}: larger than 512 MiB (inputLimits.fileMB)`]);
    expect(process.memoryUsage().rss - before).toBeLessThan(100 * 1024 * 1024);
  });
});
