// The command line as the contract fixes it: exit codes 0/1/2, a one-line message naming the file for
// unusable input, no output file left behind, the input never modified, reports in US or SI units.

import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../src/cli/main.js';
import { layoutDxf } from '../src/demo/generated-layout.js';

async function run(...args: string[]) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await main(['node', 'headcheck', ...args], { out: (s) => out.push(s), err: (s) => err.push(s) });
  return { code, out: out.join('\n'), err: err.join('\n') };
}

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'hc-cli-'));
});

describe('headcheck check', () => {
  it('checks an ezdxf-written drawing: exit 1 for its planted errors, a contract report', async () => {
    const json = join(dir, 'bay2.json');
    const r = await run('check', 'fixtures/bay2-r2000.dxf', '--json', json);
    expect(r.code).toBe(1);
    expect(r.out).toMatch(/FAIL: 13 heads/);
    const report = JSON.parse(readFileSync(json, 'utf8'));
    for (const key of ['tool', 'input', 'units', 'heads', 'pipes', 'findings', 'designAreas', 'summary'])
      expect(report).toHaveProperty(key);
    expect(report.input.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(report.input.drawingUnits).toBe('in');
    expect(report.input.layersUsed.heads).toEqual(['FP-HEAD']);
    expect(report.units).toEqual({ length: 'ft', area: 'ft2', flow: 'gpm', pressure: 'psi' });
    expect(report.summary.pass).toBe(false);
    expect(report.findings.map((f: { rule: string }) => f.rule)).toContain('head-unattached');
    expect(report.caution).toMatch(/authority having jurisdiction/);
  });

  it('prints each error and warning finding on a line, then the verdict; --quiet only the verdict; --md the summary', async () => {
    const md = join(dir, 'bay2.md');
    const r = await run('check', 'fixtures/bay2-r2000.dxf', '--md', md);
    const report = JSON.parse(readFileSync(join(dir, 'bay2.json'), 'utf8'));
    const lines = r.out.split('\n');
    expect(lines).toHaveLength(report.summary.errors + report.summary.warnings + 1);
    expect(lines.at(-1)).toMatch(/^fixtures\/bay2-r2000\.dxf: FAIL: 13 heads/);
    for (const line of lines.slice(0, -1))
      expect(line).toMatch(/^fixtures\/bay2-r2000\.dxf: (error|warning) [a-z-]+ at \(-?\d+\.\d, -?\d+\.\d\) ft: .+/);
    expect((await run('check', 'fixtures/bay2-r2000.dxf', '--quiet')).out.split('\n')).toHaveLength(1);
    const text = readFileSync(md, 'utf8');
    expect(text).toMatch(/^# Review summary: fixtures\/bay2-r2000\.dxf\n/);
    expect(text).toContain('**Verdict: FAIL**');
    expect(text).toMatch(/> headcheck is a screening aid .* authority having jurisdiction/);
    for (const f of report.findings) for (const h of f.handles) expect(text).toContain(h);
    expect(text).toContain('## Design areas');
  });

  it('exits 0 on a clean layout', async () => {
    const file = join(dir, 'clean.dxf');
    writeFileSync(file, layoutDxf({ s: 12, l: 10, heads: 4, lines: 3 }));
    const r = await run('check', file);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
  });

  it('reports in SI units with --units si (6 ft = 1.8288 m exactly)', async () => {
    const json = join(dir, 'si.json');
    await run('check', 'fixtures/bay2-r2018.dxf', '--json', json, '--units', 'si');
    const report = JSON.parse(readFileSync(json, 'utf8'));
    expect(report.units).toEqual({ length: 'm', area: 'm2', flow: 'L/min', pressure: 'bar' });
    const h = report.heads.find((x: { x: number; y: number }) => Math.abs(x.x - 1.8288) < 1e-9);
    expect(h.y).toBeCloseTo(5 * 0.3048, 9);
    // K 5.6 gpm/psi^½ is 80.7 L/min/bar^½ (factor 14.4163, derived from gallon and psi definitions)
    expect(h.kFactor).toBeCloseTo(80.731, 2);
  });

  const bad: [string, string | Uint8Array, RegExp][] = [
    ['not-dxf.dxf', '%PDF-1.7 this is not a drawing', /not a DXF file/],
    ['binary.dxf', new Uint8Array([...new TextEncoder().encode('AutoCAD Binary DXF\r\n'), 0x1a, 0, 1]), /binary DXF/],
    ['empty.dxf', '', /empty/],
    ['truncated.dxf', readFileSync('fixtures/bay2-r2000.dxf', 'latin1').slice(0, 9000), /truncated/],
    ['r12-no-units.dxf', readFileSync('fixtures/bay2-r12.dxf', 'latin1'), /length unit/],
  ];
  it.each(bad)('%s: exit 2, one line naming the file, no output left', async (name, content, message) => {
    const file = join(dir, name);
    writeFileSync(file, content);
    const json = join(dir, `${name}.json`);
    const r = await run('check', file, '--json', json);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')).toHaveLength(1);
    expect(r.err).toContain(file);
    expect(r.err).toMatch(message);
    expect(existsSync(json)).toBe(false);
  });

  it('exit 2 for a drawing without heads; one without a source is checked for its heads (exit 2 with --require-hydraulics)', async () => {
    const noHeads = join(dir, 'noheads.dxf');
    writeFileSync(noHeads, layoutDxf({ s: 12, l: 10, heads: 3, lines: 2 }).replace(/FP-HEAD/g, 'A-FURN'));
    const cfg = join(dir, 'heads.json');
    writeFileSync(cfg, JSON.stringify({ layers: { heads: ['FP-HEAD'] } }));
    expect((await run('check', noHeads, '--config', cfg)).err).toMatch(/no sprinkler heads found/);
    const noSource = join(dir, 'nosource.dxf');
    writeFileSync(noSource, layoutDxf({ s: 12, l: 10, heads: 3, lines: 2 }).replace(/FP-SOURCE/g, 'A-FURN'));
    const r = await run('check', noSource, '--config', cfg);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/PASS/);
    const strict = await run('check', noSource, '--config', cfg, '--require-hydraulics');
    expect(strict.code).toBe(2);
    expect(strict.err).toMatch(
      /^headcheck: \S*nosource\.dxf: no hydraulic calculation: no water source is drawn .*\(--require-hydraulics\)$/,
    );
  });

  it('exit 2 for a bad config, naming the file and the key', async () => {
    const cfg = join(dir, 'bad.json');
    writeFileSync(cfg, JSON.stringify({ design: { density: 'high' } }));
    const r = await run('check', 'fixtures/bay2-r2000.dxf', '--config', cfg);
    expect(r.code).toBe(2);
    expect(r.err).toContain(cfg);
    expect(r.err).toMatch(/"design.density" must be a number/);
    writeFileSync(cfg, '{ not json');
    expect((await run('check', 'fixtures/bay2-r2000.dxf', '--config', cfg)).err).toMatch(/not valid JSON/);
    writeFileSync(cfg, JSON.stringify({ colour: 'red' }));
    expect((await run('check', 'fixtures/bay2-r2000.dxf', '--config', cfg)).err).toMatch(/unknown key "colour"/);
  });

  it('exit 2 for a bad option, and refuses to write over the input', async () => {
    expect((await run('check', 'fixtures/bay2-r2000.dxf', '--units', 'metric')).code).toBe(2);
    const copy = join(dir, 'copy.dxf');
    writeFileSync(copy, readFileSync('fixtures/bay2-r2000.dxf'));
    const before = readFileSync(copy);
    const r = await run('check', copy, '--json', copy);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/may not overwrite the input/);
    expect(readFileSync(copy).equals(before)).toBe(true);
  });

  it('an output path that is a folder, or two outputs on one path: exit 2, one line, no output and no temporary file', async () => {
    const out = mkdtempSync(join(tmpdir(), 'hc-out-'));
    mkdirSync(join(out, 'report.html'));
    const asFolder = await run(
      'check',
      'fixtures/bay2-r2000.dxf',
      '--no-config',
      '--json',
      join(out, 'r.json'),
      '--html',
      join(out, 'report.html'),
    );
    expect(asFolder.code).toBe(2);
    expect(asFolder.err).toBe(`headcheck: ${join(out, 'report.html')}: is a folder, not a file to write`);
    expect(readdirSync(out)).toEqual(['report.html']);
    const shared = await run('check', 'fixtures/bay2-r2000.dxf', '--no-config', '--json', join(out, 'same'), '--html', join(out, 'same'));
    expect(shared.code).toBe(2);
    expect(shared.err).toMatch(/two outputs may not share one path/);
    expect(readdirSync(out)).toEqual(['report.html']);
  });

  it('sweeps temporary files older than an hour that a killed run left in the output folder', async () => {
    const out = mkdtempSync(join(tmpdir(), 'hc-stale-'));
    const stale = join(out, '.headcheck-r.json-99999-0a0b0c0d.tmp');
    const fresh = join(out, '.headcheck-r.json-99998-0a0b0c0e.tmp');
    writeFileSync(stale, 'left by a killed run');
    writeFileSync(fresh, 'another run, still writing');
    utimesSync(stale, new Date(Date.now() - 2 * 3600_000), new Date(Date.now() - 2 * 3600_000));
    await run('check', 'fixtures/bay2-r2000.dxf', '--no-config', '--json', join(out, 'r.json'));
    expect(readdirSync(out).sort()).toEqual(['.headcheck-r.json-99998-0a0b0c0e.tmp', 'r.json']);
  });

  it('a run stopped by SIGTERM while writing leaves no temporary file and no output', async () => {
    const out = mkdtempSync(join(tmpdir(), 'hc-killed-'));
    const drawing = join(out, 'large.dxf');
    writeFileSync(drawing, layoutDxf({ s: 12, l: 10, heads: 150, lines: 100 }));
    const child = spawn(process.execPath, [
      'bin/headcheck.js',
      'check',
      drawing,
      '--no-config',
      '--json',
      join(out, 'r.json'),
      '--dxf',
      join(out, 'r.dxf'),
      '--html',
      join(out, 'r.html'),
    ]);
    const exited = new Promise<number | null>((done) => child.on('exit', (code, signal) => done(signal ? -1 : code)));
    let sawTemp = false;
    for (let i = 0; i < 4000 && child.exitCode === null && !sawTemp; i++) {
      sawTemp = readdirSync(out).some((f) => f.startsWith('.headcheck-'));
      if (!sawTemp) await new Promise((r) => setTimeout(r, 2));
    }
    expect(sawTemp).toBe(true);
    child.kill('SIGTERM');
    expect(await exited).toBe(-1);
    expect(readdirSync(out)).toEqual(['large.dxf']);
  });

  it('a write failure is exit 2 and leaves no partial file', async () => {
    if (process.getuid?.() === 0) {
      // root ignores permission bits: write into a path whose parent is a file instead
      const r = await run('check', 'fixtures/bay2-r2000.dxf', '--json', join('fixtures/bay2-r2000.dxf', 'x.json'));
      expect(r.code).toBe(2);
      expect(r.err).toMatch(/cannot be written/);
      return;
    }
    const ro = join(dir, 'ro');
    mkdirSync(ro);
    chmodSync(ro, 0o500);
    const r = await run('check', 'fixtures/bay2-r2000.dxf', '--json', join(ro, 'x.json'));
    expect(r.code).toBe(2);
    expect(readdirSync(ro)).toEqual([]);
  });
});

describe('headcheck layers and demo', () => {
  it('lists layers with counts and roles', async () => {
    const r = await run('layers', 'fixtures/bay2-r2018.dxf');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/FP-HEAD\s+heads\s+CIRCLE 13, INSERT 14, LINE 13\s+SPK ×13 \(6 in\)/);
    expect(r.out).toMatch(/FP-PIPE\s+pipes/);
    expect(r.out).toMatch(/A-ANNO-\u00d8/);
  });

  it('layers works without a unit; --json and --config-out write the contract shape and a config check accepts', async () => {
    const json = join(dir, 'layers.json');
    const config = join(dir, 'starter.json');
    const r = await run('layers', 'fixtures/bay2-r12.dxf', '--json', json, '--config-out', config);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/no unit stated/);
    const report = JSON.parse(readFileSync(json, 'utf8'));
    expect(report.units).toBeNull();
    const head = report.layers.find((l: { name: string }) => l.name === 'FP-HEAD');
    expect(head).toMatchObject({ role: 'heads', entities: { INSERT: 14, CIRCLE: 13, LINE: 13 } });
    expect(head.blocks[0]).toMatchObject({ name: 'SPK', count: 13, size: 6 });
    // the drawing states no unit: the starter config says so, and check then asks for one
    const starter = JSON.parse(readFileSync(config, 'utf8'));
    expect(starter.layers.heads).toEqual(['FP-HEAD']);
    expect((await run('check', 'fixtures/bay2-r12.dxf', '--config', config)).err).toMatch(/length unit/);
    const withUnit = await run('check', 'fixtures/bay2-r12.dxf', '--config', config, '--drawing-units', 'in');
    expect(withUnit.code).toBe(1);
    expect(withUnit.out).toMatch(/13 heads/);
  });

  it('--drawing-units wins over the config and is checked', async () => {
    expect((await run('layers', 'fixtures/bay2-r2018.dxf', '--drawing-units', 'mm')).out).toMatch(/units mm/);
    expect((await run('check', 'fixtures/bay2-r2018.dxf', '--drawing-units', 'yd')).code).toBe(2);
  });

  it('builds and checks the demo', async () => {
    const out = join(dir, 'demo');
    const r = await run('demo', '--out', out);
    expect(r.code).toBe(0);
    expect(readdirSync(out).sort()).toEqual([
      'demo-plan.annotated.dxf',
      'demo-plan.config.json',
      'demo-plan.dxf',
      'demo-plan.html',
      'demo-plan.json',
    ]);
    const report = JSON.parse(readFileSync(join(out, 'demo-plan.json'), 'utf8'));
    expect(report.summary.heads).toBe(65);
    expect(report.summary.systems).toBe(2);
  });
});

describe('the installed command', () => {
  it('runs as a process and returns the contract exit code', () => {
    const r = spawnSync(process.execPath, ['bin/headcheck.js', 'check', 'fixtures/bay2-r2000.dxf'], { encoding: 'utf8', timeout: 60_000 });
    expect(existsSync('dist/cli/main.js')).toBe(true);
    expect(r.status).toBe(1);
    const bad = spawnSync(process.execPath, ['bin/headcheck.js', 'check', 'package.json'], { encoding: 'utf8', timeout: 60_000 });
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('starts from the code cache the build wrote for this bundle, which this Node accepts; without it the same command runs', () => {
    // One copy of the bundle: a lazy chunk's require('./main.cjs') gets the module the loader ran (else an error
    // thrown in a chunk would not be the bundle's InputError). Common practice, no source.
    const probe = `
      import { readFileSync } from 'node:fs';
      import { createRequire } from 'node:module';
      import { BUNDLE, CODE_CACHE, cachedDataFor, loadCli } from './bin/load-cli.js';
      const cached = loadCli();
      const fresh = loadCli({ useCache: false });
      const file = readFileSync(CODE_CACHE);
      console.log(JSON.stringify({
        rejected: cached.script.cachedDataRejected,
        freshCache: fresh.script.cachedDataRejected ?? null,
        shared: createRequire(BUNDLE)('./main.cjs') === fresh.cli,
        main: typeof fresh.cli.main,
        forThisSource: cachedDataFor(fresh.source, file)?.length === file.length - 64,
        forAnEditedOne: cachedDataFor(fresh.source.replace('headcheck', 'headchecc'), file) ?? null,
      }));`;
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', probe], { encoding: 'utf8', timeout: 60_000 });
    expect(r.stderr).toBe('');
    expect(JSON.parse(r.stdout)).toEqual({
      rejected: false,
      freshCache: null,
      shared: true,
      main: 'function',
      forThisSource: true,
      // A bundle edited to the same length keeps V8's own check happy: the digest refuses the old cache.
      forAnEditedOne: null,
    });
  });

  it("checks a drawing without loading Node's modules for child processes, threads or V8's internals", () => {
    // Each cost a small check 3-5 ms to load (measured with `require` alone in a fresh process); only batch, DWG
    // and large drawings' collections use them, and commander spawns no program here. Common practice, no source.
    const probe = `
      import { loadCli } from './bin/load-cli.js';
      process.stdout.write = () => true;
      await loadCli().cli.main(['node', 'headcheck', 'check', 'fixtures/bay2-r2000.dxf']);
      console.error(JSON.stringify(process.moduleLoadList));`;
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', probe], { encoding: 'utf8', timeout: 60_000 });
    const loaded: string[] = JSON.parse(r.stderr);
    expect(loaded).toContain('NativeModule fs'); // the list is the one asked for
    expect(loaded.filter((m) => /^NativeModule (child_process|worker_threads|v8)$/.test(m))).toEqual([]);
  });
});

describe('which config a command uses', () => {
  const drawing = () => {
    const sub = mkdtempSync(join(tmpdir(), 'hc-lookup-'));
    writeFileSync(join(sub, 'plan.dxf'), layoutDxf({ s: 12, l: 10, heads: 4, lines: 3 }));
    return sub;
  };

  it('check uses NAME.config.json beside the drawing, as batch does, and says so on stderr; --no-config uses none', async () => {
    const sub = drawing();
    // a limit that breaks every head: 120 ft² each against 100 (an adopted edition's override)
    writeFileSync(join(sub, 'plan.config.json'), JSON.stringify({ limits: { maxArea: 100 } }));
    const found = await run('check', join(sub, 'plan.dxf'));
    expect(found.code).toBe(1);
    expect(found.err).toBe(`headcheck: config ${join(sub, 'plan.config.json')} (found beside the drawing)`);
    const none = await run('check', join(sub, 'plan.dxf'), '--no-config');
    expect(none.code).toBe(0);
    expect(none.err).toBe('');
  });

  it('else headcheck.json in the folder or a parent; an unusable one is exit 2, one line naming it', async () => {
    const sub = drawing();
    writeFileSync(join(sub, 'headcheck.json'), JSON.stringify({ design: { hazzard: 'EH1' } }));
    const r = await run('check', join(sub, 'plan.dxf'));
    expect(r.code).toBe(2);
    expect(r.err.split('\n')).toHaveLength(1);
    expect(r.err).toBe(`headcheck: ${join(sub, 'headcheck.json')}: unknown key "design.hazzard" (did you mean "design.hazard"?)`);
  });

  it('an error in the drawing names the config found, in the same one line', async () => {
    const sub = drawing();
    writeFileSync(join(sub, 'plan.dxf'), 'not a drawing');
    writeFileSync(join(sub, 'headcheck.json'), '{}');
    const r = await run('check', join(sub, 'plan.dxf'));
    expect(r.code).toBe(2);
    expect(r.err.split('\n')).toHaveLength(1);
    expect(r.err).toMatch(/not a DXF file .*\[config .*headcheck\.json \(found in a parent folder\)\]$/);
  });
});
