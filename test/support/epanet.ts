// Runs a headcheck hydraulic model through EPANET (npm epanet-js, the OWA-EPANET 2.2 engine), an
// independent network solver: heads as emitters q = C·p^0.5 with C = K, Hazen-Williams headloss.

import { LinkProperty, NodeProperty, Project, Workspace } from 'epanet-js';
import type { HydraulicModel } from '../../src/hydraulics/model.js';

/** EPANET's own conversion between feet of water and psi (specific gravity 1). */
export const EPANET_PSI_PER_FT = 0.4333;

export interface EpanetResult {
  pressure: Map<string, number>;
  flow: Map<string, number>;
  emitterFlow: Map<string, number>;
  sourceFlow: number;
}

export async function solveWithEpanet(model: HydraulicModel, sourcePressure: number): Promise<EpanetResult> {
  const name = (i: number) => `J${i}`;
  const src = model.source;
  const lines = ['[TITLE]', 'headcheck reference network', '', '[JUNCTIONS]'];
  model.nodes.forEach((n, i) => {
    if (i !== src) lines.push(`${name(i)} ${n.elevation} 0`);
  });
  lines.push('', '[RESERVOIRS]', `${name(src)} ${model.nodes[src]!.elevation + sourcePressure / EPANET_PSI_PER_FT}`, '', '[PIPES]');
  for (const p of model.pipes) lines.push(`${p.id} ${name(p.from)} ${name(p.to)} ${p.length} ${p.diameter} ${p.c} 0 Open`);
  lines.push('', '[EMITTERS]');
  for (const e of model.emitters) lines.push(`${name(e.node)} ${e.k}`);
  lines.push('', '[OPTIONS]', 'Units GPM', 'Headloss H-W', 'Accuracy 0.000001', 'Trials 500', 'Emitter Exponent 0.5', '', '[END]', '');
  return runEpanet(lines.join('\n'), (project) => {
    const pressure = new Map<string, number>();
    const emitterFlow = new Map<string, number>();
    model.nodes.forEach((n, i) => {
      pressure.set(n.id, project.getNodeValue(project.getNodeIndex(name(i)), NodeProperty.Pressure));
    });
    model.emitters.forEach((e) => {
      emitterFlow.set(e.headId, project.getNodeValue(project.getNodeIndex(name(e.node)), NodeProperty.Demand));
    });
    const flow = new Map<string, number>();
    for (const p of model.pipes) flow.set(p.id, project.getLinkValue(project.getLinkIndex(p.id), LinkProperty.Flow));
    const sourceFlow = -project.getNodeValue(project.getNodeIndex(name(src)), NodeProperty.Demand);
    return { pressure, flow, emitterFlow, sourceFlow };
  });
}

/** Solves an EPANET input file's hydraulics and reads the results with `read` before the project closes. */
export async function runEpanet<T>(inp: string, read: (project: Project) => T): Promise<T> {
  const ws = new Workspace();
  await ws.loadModule();
  const project = new Project(ws);
  ws.writeFile('net.inp', inp);
  project.open('net.inp', 'net.rpt', 'net.out');
  project.solveH();
  try {
    return read(project);
  } finally {
    project.close();
  }
}
