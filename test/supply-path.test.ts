// The supply path from the flow-test point to the source: hand values with the formulas written out, EPANET
// (epanet-js) on the whole chain (reservoir and equivalent pipe for the flow test, underground pipe, a general-purpose
// valve with the device's loss curve, a pump with its multi-point curve, then a system), and the check's use of it.

import { LinkProperty, NodeProperty } from 'epanet-js';
import { describe, expect, it } from 'vitest';
import { parseSettings } from '../src/config/settings.js';
import { resistance } from '../src/hydraulics/hazen-williams.js';
import type { HydraulicModel } from '../src/hydraulics/model.js';
import { NetworkSolver } from '../src/hydraulics/solver.js';
import { supplyAtSource, supplyOf, type SupplySettings } from '../src/hydraulics/supply-path.js';
import { checkLayout } from './support/check.js';
import { EPANET_PSI_PER_FT, runEpanet } from './support/epanet.js';
import { contractPath } from './support/supply-path.js';

// An invented supply: a hydrant flow test 300 ft of 6 in underground away, a backflow preventer, a fire pump (the
// device and pump curves are the contract's examples, CONTRACT.md "Supply path").
const SUPPLY: SupplySettings = {
  static: 80,
  residual: 60,
  flow: 1000,
  elevation: -4,
  path: contractPath(2),
};

describe('the supply at the source, by hand', () => {
  it('750 gpm through the path: flow test, pipe, rise, device, pump and the rest of the level difference', () => {
    const q = 750;
    // Flow test: P = Ps − (Ps − Pr)·(Q/Qr)^1.85 (TRADE.md, confirmed; the NFPA 291 form).
    const test = 80 - 20 * (q / 1000) ** 1.85;
    // Pipe: NFPA 13 (2019 edition) 28.2.2.1, p = 4.52·L·Q^1.85/(C^1.85·d^4.87); 6 in Sch 40 = 6.065 in (TRADE.md).
    const pipe = (4.52 * 300 * q ** 1.85) / (140 ** 1.85 * 6.065 ** 4.87);
    // Rise: 0.433 psi per ft (TRADE.md, common practice); 2 ft in the pipe, then 4 − 2 = 2 ft more to the source.
    const rise = 0.433 * 2;
    const level = 0.433 * (0 - -4 - 2);
    // Device: 7 + (12 − 7)·(750 − 500)/(1500 − 500) = 8.25; pump: +110 at 750 (the curves above).
    const expected = test - pipe - rise - 8.25 + 110 - level;
    const at = supplyAtSource(SUPPLY, 0);
    expect(at.available(q)).toBeCloseTo(expected, 6);
    expect(test).toBeCloseTo(68.2539, 3); // 0.75^1.85 = 0.58730
    const steps = at.steps(q);
    expect(steps.map((s) => s.type)).toEqual(['pipe', 'device', 'pump', 'elevation']);
    expect(steps[0]!.pressureFrom).toBeCloseTo(test, 9);
    expect(steps[0]!.loss).toBeCloseTo(pipe + rise, 9);
    expect(steps[2]!.loss).toBeCloseTo(-110, 9);
    expect(steps.at(-1)!.pressureTo).toBeCloseTo(expected, 9);
    expect(at.nonIncreasing).toBe(true);
  });

  it('a pump curve that rises somewhere is said, so the search calculates every candidate', () => {
    const rising: SupplySettings = {
      ...SUPPLY,
      path: [
        {
          type: 'pump',
          name: 'pump rising near churn',
          curve: [
            [0, 100],
            [300, 104],
            [1000, 90],
          ],
        },
      ],
    };
    expect(supplyAtSource(rising, 0).nonIncreasing).toBe(false);
    const spec = { s: 12, l: 10, heads: 8, lines: 8 };
    const design = { hazard: 'OH2', density: 0.2, area: 1500 };
    const plain = checkLayout(spec, { design, supply: { static: 80, residual: 60, flow: 1000 } });
    const pumped = checkLayout(spec, { design, supply: rising });
    expect(plain.report.design.search!.pruned).toBe(true);
    expect(pumped.report.design.search!.pruned).toBe(false);
    expect(pumped.report.design.search!.evaluated).toBe(pumped.report.design.search!.candidates);
  });
});

describe('the path in a check', () => {
  it('each calculated area carries the path at its total demand, ending at the available pressure', () => {
    const r = checkLayout({ s: 12, l: 10, heads: 8, lines: 8 }, { design: { hazard: 'OH2', density: 0.2, area: 1500 }, supply: SUPPLY });
    const settings = parseSettings({ supply: SUPPLY });
    for (const a of r.report.designAreas.filter((x) => x.hydraulics)) {
      const h = a.hydraulics!;
      expect(h.supplyPath.map((s) => s.type)).toEqual(['pipe', 'device', 'pump', 'elevation']);
      expect(h.supplyPath.at(-1)!.pressureTo).toBeCloseTo(h.supplyAvailable!, 3);
      expect(h.supplyAvailable!).toBeCloseTo(supplyOf(settings)!.available(h.totalDemand), 3);
      expect(h.margin!).toBeCloseTo(h.supplyAvailable! - h.sourcePressure, 3);
    }
  });
});

/** A small tree: a 3 in feed 40 ft to a cross main, two 1-1/4 in branch lines of four K 5.6 heads 12 ft apart. */
function tree(): HydraulicModel {
  const nodes = [{ id: 'S', elevation: 0 }];
  const pipes: HydraulicModel['pipes'] = [];
  const emitters: HydraulicModel['emitters'] = [];
  const pipe = (from: number, to: number, length: number, nominalSize: '3' | '1-1/4', diameter: number) => {
    pipes.push({
      id: `P${pipes.length}`,
      from,
      to,
      length,
      fittingsLength: 0,
      fittings: [],
      nominalSize,
      diameter,
      c: 120,
      r: resistance(length, 120, diameter),
      run: 0,
    });
  };
  const node = (elevation: number) => nodes.push({ id: `N${nodes.length}`, elevation }) - 1;
  const main = node(12);
  pipe(0, main, 40, '3', 3.068);
  let at = main;
  for (let line = 0; line < 2; line++) {
    const tee = node(12);
    pipe(at, tee, 10, '3', 3.068);
    at = tee;
    let prev = tee;
    for (let h = 0; h < 4; h++) {
      const n = node(12);
      pipe(prev, n, 12, '1-1/4', 1.38);
      emitters.push({ node: n, headId: `H${line}${h}`, k: 5.6, required: 7 });
      prev = n;
    }
  }
  return { nodes, pipes, emitters, source: 0, riser: { modelled: 'none', length: 0, nominalSize: '3' } };
}

/** EPANET's Hazen-Williams loss in US units, ft: 4.727·L·Q^1.852/(C^1.852·d^4.871), Q cfs, d ft (EPANET 2.2 manual). */
const epanetLossFt = (lengthFt: number, gpm: number, c: number, diameterIn: number) =>
  (4.727 * lengthFt * (gpm / 448.831) ** 1.852) / (c ** 1.852 * (diameterIn / 12) ** 4.871);

/** The whole chain in EPANET: test point reservoir → equivalent pipe → underground pipe → valve → pump → system. */
async function epanetChain(model: HydraulicModel, supply: SupplySettings) {
  const [pipe, device, pump] = supply.path as [
    Extract<NonNullable<SupplySettings['path']>[number], { type: 'pipe' }>,
    Extract<NonNullable<SupplySettings['path']>[number], { type: 'device' }>,
    Extract<NonNullable<SupplySettings['path']>[number], { type: 'pump' }>,
  ];
  const ft = (psi: number) => psi / EPANET_PSI_PER_FT;
  // The equivalent pipe: 12 in, C 100, long enough to lose Ps − Pr at the test flow.
  const equivalentLength = ft(supply.static - supply.residual) / epanetLossFt(1, supply.flow, 100, 12);
  const z = supply.elevation!;
  const lines = [
    '[TITLE]',
    'flow test, supply path and system',
    '',
    '[JUNCTIONS]',
    `T1 ${z} 0`,
    `T2 ${z + pipe.rise} 0`,
    `T3 ${z + pipe.rise} 0`,
    `T4 ${z + pipe.rise} 0`,
  ];
  for (const [i, n] of model.nodes.entries()) lines.push(`J${i} ${n.elevation} 0`);
  lines.push('', '[RESERVOIRS]', `TEST ${z + ft(supply.static)}`, '', '[PIPES]');
  lines.push(`EQUIV TEST T1 ${equivalentLength} 12 100 0 Open`);
  lines.push(`UNDER T1 T2 ${pipe.length} 6.065 ${pipe.cFactor} 0 Open`);
  // From the pump to the source at the source's level: the level difference costs no friction (a short wide pipe).
  lines.push(`LEVEL T4 J${model.source} 1 48 150 0 Open`);
  for (const p of model.pipes) lines.push(`${p.id} J${p.from} J${p.to} ${p.length} ${p.diameter} ${p.c} 0 Open`);
  lines.push('', '[VALVES]', 'BFP T2 T3 6 GPV DEVICE 0', '', '[PUMPS]', 'PUMP T3 T4 HEAD PUMPCURVE', '', '[CURVES]');
  for (const [q, p] of device.loss) lines.push(`DEVICE ${q} ${ft(p)}`);
  for (const [q, p] of pump.curve) lines.push(`PUMPCURVE ${q} ${ft(p)}`);
  lines.push('', '[EMITTERS]');
  for (const e of model.emitters) lines.push(`J${e.node} ${e.k}`);
  lines.push('', '[OPTIONS]', 'Units GPM', 'Headloss H-W', 'Accuracy 0.000001', 'Trials 500', 'Emitter Exponent 0.5', '', '[END]', '');
  const { sourcePressure, flow, headFlows } = await runEpanet(lines.join('\n'), (project) => ({
    sourcePressure: project.getNodeValue(project.getNodeIndex(`J${model.source}`), NodeProperty.Pressure),
    flow: project.getLinkValue(project.getLinkIndex('UNDER'), LinkProperty.Flow),
    headFlows: model.emitters.map((e) => project.getNodeValue(project.getNodeIndex(`J${e.node}`), NodeProperty.Demand)),
  }));
  return { sourcePressure, flow, headFlows };
}

describe('the supply path against EPANET', () => {
  it('the system on its supply: where the supply at the source meets the system, within 1% of EPANET on the whole chain', async () => {
    const model = tree();
    const solver = new NetworkSolver(model);
    const supply = supplyAtSource(SUPPLY, 0);
    // The operating point: the source pressure P at which the supply, at the flow the system then takes, gives P.
    const flowAt = (p: number) => solver.solve(p).flow.reduce((a, b) => a + b, 0);
    let lo = 1;
    let hi = supply.available(0);
    for (let i = 0; i < 80; i++) {
      const mid = (lo + hi) / 2;
      if (supply.available(flowAt(mid)) > mid) lo = mid;
      else hi = mid;
    }
    const ours = solver.solve(lo);
    const oursFlow = ours.flow.reduce((a, b) => a + b, 0);
    const ep = await epanetChain(model, SUPPLY);
    expect(Math.abs(lo - ep.sourcePressure) / ep.sourcePressure).toBeLessThan(0.01);
    expect(Math.abs(oursFlow - ep.flow) / ep.flow).toBeLessThan(0.01);
    // The available pressure at the source at EPANET's flow is EPANET's pressure there.
    expect(Math.abs(supply.available(ep.flow) - ep.sourcePressure) / ep.sourcePressure).toBeLessThan(0.01);
    ours.flow.forEach((q, x) => {
      const k = ours.open[x]!;
      expect(Math.abs(q - ep.headFlows[k]!) / ep.headFlows[k]!).toBeLessThan(0.01);
    });
  });
});
