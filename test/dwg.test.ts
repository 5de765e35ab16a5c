// DWG input told by its first bytes, refused in one line when its version is not read or its content is broken,
// and held to its time limit; batch picks DWG files up beside DXF ones.

import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { createHash } from 'node:crypto';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { dwgAsDxf, dwgAsDxfHere, libreDwgModule } from '../src/io/dwg.js';
import { dwgToDxf } from '../src/read/dwg/dwg-to-dxf.js';
import { dwgRelease, dwgVersionTag } from '../src/read/dwg/version.js';
import { parseSettings } from '../src/config/settings.js';
import { describeWith } from './support/external.js';

const bytesOf = (s: string, pad = 0) => new Uint8Array([...Buffer.from(s, 'latin1'), ...new Uint8Array(pad)]);

function cli(...args: string[]) {
  return spawnSync(process.execPath, ['bin/headcheck.js', ...args], { encoding: 'utf8', timeout: 120_000 });
}

describe('telling a DWG', () => {
  it.each([
    // The version tags and releases: from memory (the Open Design Alliance's DWG specification lists them); AC1040 is
    // an invented later tag. The samples of ../shared/real-dwg carry AC1014 to AC1032 as their names say.
    ['AC1009', 'R11/R12', null],
    ['AC1012', 'R13', 'R13'],
    ['AC1014', 'R14', 'R14'],
    ['AC1015', '2000', '2000'],
    ['AC1018', '2004', '2004'],
    ['AC1021', '2007', '2007'],
    ['AC1024', '2010', '2010'],
    ['AC1027', '2013', '2013'],
    ['AC1032', '2018', '2018'],
    ['AC1040', 'a later one (invented tag)', null],
  ])('%s (%s)', (tag, _release, read) => {
    expect(dwgVersionTag(bytesOf(tag, 100))).toBe(tag);
    expect(dwgRelease(tag)).toBe(read);
  });

  it('by its bytes, not its name: a DXF is no DWG, nor is a short or a text file', () => {
    expect(dwgVersionTag(bytesOf('  0\nSECTION\n'))).toBeNull();
    expect(dwgVersionTag(bytesOf('AC10'))).toBeNull();
    expect(dwgVersionTag(bytesOf('ACAD15 drawing'))).toBeNull();
  });
});

describe('DWG limits in the config', () => {
  it('dwgMemoryMB starts at 1024: the reader reserves 1 GiB of address space at start', () => {
    expect(() => parseSettings({ inputLimits: { dwgMemoryMB: 512 } })).toThrow(/"inputLimits.dwgMemoryMB" must be at least 1024/);
    expect(parseSettings({ inputLimits: { dwgMemoryMB: 1024 } }).inputLimits.dwgMemoryMB).toBe(1024);
  });
});

describe('DWG refused in one line', () => {
  it.each([
    ['an R12 DWG', bytesOf('AC1009', 4000), /DWG version AC1009 is not supported \(R13 to 2018 are\)/],
    ['a version after 2018', bytesOf('AC1040', 4000), /DWG version AC1040 is not supported/],
    ['a 2000 header over zeros', bytesOf('AC1015', 4000), /the DWG could not be read/],
    ['a 2018 header over text', bytesOf(`AC1032${'not a drawing '.repeat(300)}`), /the DWG could not be read/],
  ])(
    '%s',
    async (_what, bytes, message) => {
      await expect(dwgToDxf(bytes, await libreDwgModule(), { memoryMB: 2048 })).rejects.toThrow(message);
      const dir = mkdtempSync(join(tmpdir(), 'hc-dwg-bad-'));
      const file = join(dir, 'plan.dxf'); // named .dxf: the bytes decide
      writeFileSync(file, bytes);
      for (const command of ['check', 'layers']) {
        const r = cli(command, file, '--no-config');
        expect(r.status).toBe(2);
        const lines = r.stderr.trim().split('\n');
        expect(lines).toHaveLength(1);
        expect(lines[0]).toContain(file);
        expect(lines[0]).toMatch(message);
      }
      expect(readdirSync(dir)).toEqual(['plan.dxf']);
    },
    120_000,
  );
});

const SAMPLE = '../shared/real-dwg/2018_Dynblocks.dwg';
describeWith('../shared/real-dwg (the DWG samples)', existsSync(SAMPLE), 'DWG limits', () => {
  it('time: a worker past inputLimits.dwgSeconds is ended, with the limit named', async () => {
    const bytes = new Uint8Array(readFileSync(SAMPLE));
    await expect(dwgAsDxf(bytes, { seconds: 0.05, memoryMB: 2048 })).rejects.toThrow(/longer than 0.05 s \(inputLimits.dwgSeconds\)/);
  }, 120_000);

  it('the DXF of a DWG does not depend on where the program runs from (path, locale)', async () => {
    // LibreDWG reads past the end of an MTEXT string of this sample: what it reads must not vary with the environment.
    const sample = '../shared/real-dwg/acs_AC1032.dwg';
    const hash = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');
    const here = hash(await dwgAsDxfHere(new Uint8Array(readFileSync(sample)), { seconds: 60, memoryMB: 2048 }));
    // The script's path is in the module's environment: run it from folders of three lengths (allocations align
    // to 16 bytes, so lengths 24 and 72 characters apart land in different places).
    const base = mkdtempSync(join(tmpdir(), 'hc-dwg-env-'));
    for (const extra of ['', 'x'.repeat(24), join('y'.repeat(36), 'z'.repeat(35))]) {
      const dir = join(base, extra);
      mkdirSync(dir, { recursive: true });
      const script = join(dir, 'convert.mjs');
      writeFileSync(
        script,
        `import { dwgAsDxfHere } from ${JSON.stringify(pathToFileURL(resolve('dist/io/dwg.js')).href)};\n` +
          `import { readFileSync } from 'node:fs';\nimport { createHash } from 'node:crypto';\n` +
          `const d = await dwgAsDxfHere(new Uint8Array(readFileSync(${JSON.stringify(resolve(sample))})), { seconds: 60, memoryMB: 2048 });\n` +
          `process.stdout.write(createHash('sha256').update(d).digest('hex'));\n`,
      );
      const env = { ...process.env, LANG: extra ? 'de_DE.UTF-8' : 'C' };
      const r = spawnSync(process.execPath, [script], { cwd: dir, encoding: 'utf8', timeout: 120_000, env });
      expect(r.status, r.stderr).toBe(0);
      expect(r.stdout, dir).toBe(here);
    }
  }, 180_000);

  it('compare takes DWG: a drawing against itself has nothing resolved or added', () => {
    const dir = mkdtempSync(join(tmpdir(), 'hc-dwg-compare-'));
    const drawing = '../shared/real-dwg/2013_gh44-error.dwg';
    const args = ['bin/headcheck.js', 'compare', drawing, drawing, '--no-config', '--json', join(dir, 'c.json')];
    const r = spawnSync(process.execPath, args, { encoding: 'utf8', timeout: 180_000 });
    expect(r.status, r.stderr).toBe(1);
    const c = JSON.parse(readFileSync(join(dir, 'c.json'), 'utf8'));
    expect([c.findings.resolved.length, c.findings.added.length]).toEqual([0, 0]);
    expect(c.findings.unchanged.length).toBeGreaterThan(0);
  }, 240_000);

  it('batch reads DWG beside DXF and names the format in each report', () => {
    const dir = mkdtempSync(join(tmpdir(), 'hc-dwg-batch-'));
    const set = join(dir, 'set');
    mkdirSync(set);
    writeFileSync(join(set, 'a.dwg'), readFileSync('../shared/real-dwg/2013_gh44-error.dwg'));
    writeFileSync(join(set, 'b.dxf'), readFileSync('fixtures/bay2-r2000.dxf'));
    const r = spawnSync(process.execPath, ['bin/headcheck.js', 'batch', set, '--out', join(dir, 'out')], {
      encoding: 'utf8',
      timeout: 180_000,
    });
    expect([0, 1]).toContain(r.status);
    const reports = readdirSync(join(dir, 'out')).filter((f) => f.endsWith('.json') && f !== 'summary.json');
    const formats = reports.map((f) => JSON.parse(readFileSync(join(dir, 'out', f), 'utf8')).input?.format).sort();
    expect(formats).toEqual(['dwg', 'dxf']);
  }, 240_000);
});
