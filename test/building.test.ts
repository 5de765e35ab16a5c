// Whole buildings drawn by ezdxf (fixtures/building-*.dxf, scripts/make-fixtures.py): two risers, an office and a
// storage zone on one system, an L-shaped room. Checked outside the project: EPANET (npm epanet-js) recomputes
// every system's and zone's most demanding area (source flow and node pressures within 1%), and ezdxf measures the
// outlines drawn on the annotated drawing (inside the room, enclosing the reported actual area).

import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { FORMATS } from '../src/check/formats.js';
import { parseSettings } from '../src/config/settings.js';
import type { DesignAreaResult } from '../src/design-area/evaluate.js';
import { signedArea } from '../src/geometry/polygon.js';
import { buildModel } from '../src/hydraulics/model.js';
import { checkText, findingsOf } from './support/check.js';
import { solveWithEpanet } from './support/epanet.js';
import { describeWith, hasEzdxf, SYSTEM_PYTHON } from './support/external.js';

const truth = JSON.parse(readFileSync('fixtures/building.truth.json', 'utf8')) as Record<
  string,
  { file: string; risers: string[]; heads: { handle: string; x: number; y: number }[] }
>;
/** An invented flow test; LH 0.10 gpm/ft² and OH2 0.20 gpm/ft² over 1500 ft² are the curves' start points (TRADE.md: NFPA 13 (2019), confirmed by a secondary source). */
const SUPPLY = { static: 75, residual: 55, flow: 900 };
const CONFIGS: Record<string, Record<string, unknown>> = {
  'two-risers': { supply: SUPPLY },
  zones: { zones: { 'OFFICE*': { hazard: 'LH' }, '*STORAGE*': { hazard: 'OH2' } }, supply: SUPPLY },
  'l-room': { supply: SUPPLY },
};
const checked = Object.fromEntries(
  Object.entries(truth).map(([name, t]) => [name, checkText(readFileSync(join('fixtures', t.file), 'latin1'), CONFIGS[name])]),
);

describe('buildings drawn by ezdxf', () => {
  it('reads every head ezdxf wrote, at its place', () => {
    for (const [name, t] of Object.entries(truth)) {
      const heads = checked[name]!.plan.heads.map((h) => ({ handle: h.handle, x: h.position.x, y: h.position.y }));
      expect(heads.map((h) => h.handle).sort(), name).toEqual(t.heads.map((h) => h.handle).sort());
      for (const h of t.heads)
        expect(heads.find((x) => x.handle === h.handle)).toMatchObject({ x: expect.closeTo(h.x, 9), y: expect.closeTo(h.y, 9) });
    }
  });

  it('two risers: two systems named by the risers, each with its own most demanding area and runner-up', () => {
    const r = checked['two-risers']!;
    expect(r.network.systems.map((s) => s.id)).toEqual(truth['two-risers']!.risers);
    for (const id of truth['two-risers']!.risers) {
      expect(r.report.designAreas.filter((a) => a.system === id).map((a) => a.rank)).toEqual(['most-demanding', 'runner-up']);
    }
    // the west hall (x < 70 ft) holds 20 heads, the east hall 15
    expect(r.network.systems.map((s) => s.headIds.length)).toEqual([20, 15]);
    expect(r.report.summary).toMatchObject({ systems: 2, errors: 0 });
  });

  it('zones: each head takes its zone by position; the office takes LH, the storage OH2, each with its hose allowance', () => {
    const r = checked['zones']!;
    expect(r.report.zones.map((z) => [z.label, z.hazard, z.heads.length])).toEqual([
      ['OFFICE 1.01', 'LH', 12],
      ['STORAGE 1.02', 'OH2', 16],
    ]);
    const inOffice = new Set(truth['zones']!.heads.filter((h) => h.x < 36).map((h) => h.handle));
    const office = r.report.zones[0]!.heads.map((id) => r.plan.heads.find((h) => h.id === id)!.handle);
    expect(new Set(office)).toEqual(inOffice);
    const best = (label: string) => r.report.designAreas.find((a) => a.zone === label && a.rank === 'most-demanding')!;
    // LH 0.10 gpm/ft², 100 gpm hose; OH2 0.20 gpm/ft², 250 gpm hose (NFPA 13 (2019), TRADE.md: confirmed)
    expect(best('OFFICE 1.01')).toMatchObject({ hazard: 'LH', density: 0.1, area: 1500 });
    expect(best('OFFICE 1.01').hydraulics!.hoseAllowance).toBe(100);
    expect(best('STORAGE 1.02')).toMatchObject({ hazard: 'OH2', density: 0.2, area: 1500 });
    expect(best('STORAGE 1.02').hydraulics!.hoseAllowance).toBe(250);
  });

  it('zones: the office (12 heads, 1440 ft² of S × L) is smaller than its 1500 ft² design area: all its heads flow, said', () => {
    const office = checked['zones']!.design.areas.find((a) => a.rank === 'most-demanding' && a.basis.hazard === 'LH')!;
    expect(office.headIds).toHaveLength(12);
    expect(office.coveredArea).toBeCloseTo(1440, 9);
    expect(office.note).toMatch(/larger than the zone OFFICE 1\.01 of system \S+ \(12 heads, 1440 ft²\): every head flows/);
  });

  it('zones: no zone without a basis, and the limits of each hazard apply to its heads only', () => {
    const r = checked['zones']!;
    expect(findingsOf(r, 'zone-unmatched')).toEqual([]);
    expect(r.report.zones.map((z) => z.limits.maxArea)).toEqual([225, 130]);
    expect(r.report.summary.errors).toBe(0);
  });

  for (const name of Object.keys(truth)) {
    it(`${name}: EPANET at each most demanding area's source pressure gives its flow and pressures (1%)`, async () => {
      const r = checked[name]!;
      const settings = parseSettings(CONFIGS[name]);
      const areas = r.design.areas.filter((a) => a.rank === 'most-demanding');
      expect(areas.length).toBeGreaterThan(0);
      for (const area of areas) await expectEpanetAgrees(r, area, settings);
    });
  }
});

async function expectEpanetAgrees(r: ReturnType<typeof checkText>, area: DesignAreaResult, settings: ReturnType<typeof parseSettings>) {
  const h = area.hydraulics!;
  const byId = new Map(r.plan.heads.map((x) => [x.id, x]));
  const flowing = area.headIds.map((id) => ({
    head: byId.get(id)!,
    required: Math.max(7, ((area.basis.density * r.coverage.get(id)!.area!) / byId.get(id)!.kFactor) ** 2),
  }));
  const source = r.network.systems.find((s) => s.id === area.system)!.sourceNodeId;
  const model = buildModel(r.network, source, flowing, settings);
  const e = await solveWithEpanet(model, h.sourcePressure);
  expect(Math.abs(e.sourceFlow - h.sourceFlow) / h.sourceFlow).toBeLessThan(0.01);
  const reservoir = model.nodes[model.source]!.id;
  for (const n of h.nodes.filter((x) => x.id !== reservoir)) {
    expect(Math.abs(e.pressure.get(n.id)! - n.pressure) / h.sourcePressure).toBeLessThan(0.01);
  }
}

describeWith('python3-ezdxf', hasEzdxf(), 'design-area outlines measured by ezdxf', () => {
  const dir = mkdtempSync(join(tmpdir(), 'hc-building-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  for (const name of Object.keys(truth)) {
    it(`${name}: every outline ring lies in the room, and the rings enclose each searched area's actual area`, () => {
      const r = checked[name]!;
      const file = join(dir, `${name}.dxf`);
      const pieces = FORMATS.dxf.make(r);
      writeFileSync(file, Buffer.concat(pieces.map((x) => Buffer.from(x))));
      const p = spawnSync(SYSTEM_PYTHON, ['scripts/ezdxf-areas.py', file, 'A-WALL'], { encoding: 'utf8', timeout: 60_000 });
      expect(p.status, p.stderr).toBe(0);
      const measured = JSON.parse(p.stdout) as { rooms: number; rings: { area: number; inside: boolean }[] };
      expect(measured.rooms).toBe(name === 'two-risers' ? 2 : 1);
      expect(measured.rings.every((ring) => ring.inside)).toBe(true);
      // the drawing is in inches: 144 in² a ft²
      const ours = r.design.areas.flatMap((a) => a.outline.map((ring) => Math.abs(signedArea(ring))));
      expect(measured.rings.map((ring) => ring.area / 144).sort((a, b) => a - b)).toEqual(
        ours.sort((a, b) => a - b).map((x) => expect.closeTo(x, 6)),
      );
      for (const a of r.design.areas.filter((x) => x.source === 'search')) {
        expect(a.outline.reduce((s, ring) => s + signedArea(ring), 0)).toBeCloseTo(a.actualArea, 6);
      }
    });
  }
});
