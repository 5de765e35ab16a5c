// Batch screening through the installed command: every file accounted for with its verdict, a corrupt or
// non-DXF file never affects the others, per-drawing configs, reuse of unchanged results, --force, same-named
// files in two folders, and per-file time and memory limits.

import { type SpawnSyncReturns, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { layoutDxf } from '../src/demo/generated-layout.js';

let last: SpawnSyncReturns<string> | undefined;
const run = (...args: string[]) => {
  last = spawnSync(process.execPath, ['bin/headcheck.js', 'batch', ...args], { encoding: 'utf8', timeout: 300_000 });
  return last;
};
type Row = { file: string; status: string; message: string | null; config: string | null; heads: number | null; margin: number | null };
/** The summary's rows; where there is none, the failure says how the last run ended. */
const summary = (out: string) => {
  const file = join(out, 'summary.json');
  if (!existsSync(file))
    throw new Error(`no ${file}: the batch ended with ${last?.status ?? last?.signal} and printed ${last?.stderr.slice(-2000)}`);
  return JSON.parse(readFileSync(file, 'utf8')).drawings as Row[];
};

let set: string;
beforeAll(() => {
  set = mkdtempSync(join(tmpdir(), 'hc-batch-'));
  mkdirSync(join(set, 'east', 'level1'), { recursive: true });
  mkdirSync(join(set, 'west'), { recursive: true });
  // A clean layout with an ample supply passes; the demo fails on its planted findings.
  writeFileSync(join(set, 'clean.dxf'), layoutDxf({ s: 12, l: 10, heads: 4, lines: 3 }));
  writeFileSync(join(set, 'headcheck.json'), JSON.stringify({ supply: { static: 120, residual: 100, flow: 1500 } }));
  writeFileSync(join(set, 'east', 'level1', 'plan.dxf'), demoDrawing());
  writeFileSync(join(set, 'east', 'level1', 'plan.config.json'), JSON.stringify(DEMO_CONFIG));
  copyFileSync('fixtures/bay2-r2018.dxf', join(set, 'west', 'plan.DXF'));
  writeFileSync(join(set, 'west', 'broken.dxf'), readFileSync('fixtures/bay2-r2000.dxf').subarray(0, 6000));
  writeFileSync(join(set, 'west', 'notes.dxf'), 'meeting notes, not a drawing\n');
  writeFileSync(join(set, 'west', 'readme.txt'), 'not a dxf by its name');
});

describe('headcheck batch', () => {
  it('accounts for every drawing with the right verdict; bad files do not stop the rest', () => {
    const out = join(set, 'out');
    const r = run(set, '--out', out, '--workers', '2');
    expect(r.status, r.stderr).toBe(2);
    const rows = summary(out);
    const verdict = Object.fromEntries(rows.map((x) => [x.file.slice(set.length + 1), x.status]));
    expect(verdict).toEqual({
      'clean.dxf': 'pass',
      'east/level1/plan.dxf': 'fail',
      'west/broken.dxf': 'error',
      'west/notes.dxf': 'error',
      'west/plan.DXF': 'fail',
    });
    const byFile = (f: string) => rows.find((x) => x.file.endsWith(f))!;
    expect(byFile('broken.dxf').message).toMatch(/truncated/);
    expect(byFile('notes.dxf').message).toMatch(/not a DXF file/);
    // configs: beside the drawing, else headcheck.json up the tree
    expect(byFile('level1/plan.dxf').config).toBe(join(set, 'east', 'level1', 'plan.config.json'));
    expect(byFile('west/plan.DXF').config).toBe(join(set, 'headcheck.json'));
    expect(byFile('clean.dxf').margin).toBeGreaterThan(0);
    // same-named drawings in two folders get distinct outputs; nothing is written outside --out
    const files = readdirSync(out);
    expect(files.filter((f) => f.endsWith('.json') && f.includes('plan'))).toHaveLength(2);
    for (const f of ['summary.json', 'summary.csv', 'index.html']) expect(files).toContain(f);
    const csv = readFileSync(join(out, 'summary.csv'), 'utf8').trim().split('\n');
    expect(csv).toHaveLength(7); // a header, five drawings, and the caution as the last row
    expect(csv.at(-1)).toMatch(/^caution,.*authority having jurisdiction/);
    expect(JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8')).caution).toMatch(/licensed fire-protection engineer/);
    const index = readFileSync(join(out, 'index.html'), 'utf8');
    expect(index.indexOf('broken.dxf')).toBeLessThan(index.indexOf('clean.dxf')); // worst first
    expect(index).toMatch(/authority having jurisdiction/);
    // the Markdown summary only when asked for
    expect(files.filter((f) => f.endsWith('.md'))).toEqual([]);
  });

  it('writes a review summary per drawing with --md', () => {
    const out = join(set, 'out-md');
    const r = run(join(set, 'clean.dxf'), '--out', out, '--md', '--no-dxf', '--no-html');
    expect(r.status, r.stderr).toBe(0);
    const md = readdirSync(out).filter((f) => f.endsWith('.md'));
    expect(md).toHaveLength(1);
    expect(readFileSync(join(out, md[0]!), 'utf8')).toMatch(/\*\*Verdict: PASS\*\*[\s\S]*authority having jurisdiction/);
  });

  it('reuses unchanged results, never a drawing that could not be checked, redoes changed ones, and all with --force', () => {
    const out = join(set, 'out-reuse');
    run(set, '--out', out);
    const again = run(set, '--out', out);
    // the three checked drawings are reused; the broken and the non-DXF file are tried again
    expect(again.stderr).toMatch(/3 reused/);
    expect(again.stderr).toMatch(/5\/5 drawings, 2 could not be checked/);
    writeFileSync(join(set, 'clean.dxf'), layoutDxf({ s: 12, l: 10, heads: 5, lines: 3 }));
    const changed = run(set, '--out', out);
    expect(changed.stderr).toMatch(/2 reused/);
    expect(summary(out).find((x) => x.file.endsWith('clean.dxf'))!.heads).toBe(15);
    const forced = run(set, '--out', out, '--force');
    expect(forced.stderr).not.toMatch(/reused/);
  });

  it('marks a drawing that runs too long or too big as failed, with the reason', () => {
    const big = mkdtempSync(join(tmpdir(), 'hc-batch-big-'));
    writeFileSync(join(big, 'large.dxf'), layoutDxf({ s: 12, l: 10, heads: 100, lines: 60 }));
    writeFileSync(join(big, 'small.dxf'), layoutDxf({ s: 12, l: 10, heads: 3, lines: 2 }));
    const slow = run(big, '--out', join(big, 'o1'), '--time-limit', '0.2', '--workers', '1', '--no-dxf', '--no-html');
    const rows = summary(join(big, 'o1'));
    expect(rows.find((x) => x.file.endsWith('large.dxf'))!.message).toMatch(/timed out after 0.2 s/);
    expect(slow.status).toBe(2);
    const hungry = run(big, '--out', join(big, 'o2'), '--memory-limit', '24', '--workers', '1', '--no-dxf', '--no-html');
    const rows2 = summary(join(big, 'o2'));
    expect(rows2.find((x) => x.file.endsWith('large.dxf'))!.message).toMatch(/out of memory|worker failed/);
    expect(hungry.status).toBe(2);
  });

  it('marks every drawing as failed when a worker runs out of memory before it can take one (a 2 MB heap loads no worker)', () => {
    // Node's own code and the checker's modules take more than 2 MB of heap (measured here: 8 MB loads no worker,
    // 16 MB does): common practice, no source.
    const tiny = mkdtempSync(join(tmpdir(), 'hc-batch-tiny-'));
    writeFileSync(join(tiny, 'a.dxf'), layoutDxf({ s: 12, l: 10, heads: 3, lines: 2 }));
    writeFileSync(join(tiny, 'b.dxf'), layoutDxf({ s: 12, l: 10, heads: 4, lines: 2 }));
    for (const workers of ['1', '2']) {
      const out = join(tiny, `o${workers}`);
      const r = run(tiny, '--out', out, '--memory-limit', '2', '--workers', workers, '--no-dxf', '--no-html');
      expect(summary(out).map((x) => [x.status, x.message])).toEqual([
        ['error', 'ran out of memory (limit 2 MB)'],
        ['error', 'ran out of memory (limit 2 MB)'],
      ]);
      expect(r.status, r.stderr).toBe(2);
    }
  });

  it("counts a time limit from each drawing's start: one worker, 40 drawings, none timed out while queued", () => {
    // each takes a tenth of a second or so; all of them together several times the limit
    const many = mkdtempSync(join(tmpdir(), 'hc-batch-many-'));
    for (let i = 0; i < 40; i++) writeFileSync(join(many, `p${i}.dxf`), layoutDxf({ s: 12, l: 10, heads: 20, lines: 12 }));
    const started = performance.now();
    const r = run(many, '--out', join(many, 'o'), '--workers', '1', '--time-limit', '1.5', '--no-dxf', '--no-html');
    expect(performance.now() - started).toBeGreaterThan(1500);
    expect(r.status, r.stderr).toBe(0);
    expect(summary(join(many, 'o')).map((x) => x.status)).toEqual(Array(40).fill('pass'));
  });

  it('follows a link inside the batch folder, lists one that leads out as skipped with the reason', () => {
    const linked = mkdtempSync(join(tmpdir(), 'hc-batch-links-'));
    const outside = mkdtempSync(join(tmpdir(), 'hc-batch-outside-'));
    writeFileSync(join(linked, 'a.dxf'), layoutDxf({ s: 12, l: 10, heads: 3, lines: 2 }));
    writeFileSync(join(outside, 'far.dxf'), layoutDxf({ s: 12, l: 10, heads: 3, lines: 2 }));
    mkdirSync(join(linked, 'sub'));
    symlinkSync(join(linked, 'a.dxf'), join(linked, 'sub', 'same-as-a.dxf'));
    symlinkSync(join(outside, 'far.dxf'), join(linked, 'far.dxf'));
    symlinkSync(linked, join(linked, 'sub', 'loop'));
    const r = run(linked, '--out', join(linked, 'o'), '--no-dxf', '--no-html');
    expect(r.status, r.stderr).toBe(0);
    const rows = summary(join(linked, 'o'));
    expect(rows.map((x) => [x.file.slice(linked.length + 1), x.status])).toEqual([
      ['a.dxf', 'pass'],
      ['far.dxf', 'skipped'],
    ]);
    expect(rows[1]!.message).toMatch(/a symbolic link out of the batch folder/);
  });

  it('an output folder that cannot be made is exit 2 with one line', () => {
    const r = run(set, '--out', join('fixtures/bay2-r2000.dxf', 'out'));
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/cannot be created \(ENOTDIR\)/);
  });

  it('refuses a missing input with exit 2 and one line', () => {
    const r = run(join(set, 'nowhere'), '--out', join(set, 'o3'));
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});
