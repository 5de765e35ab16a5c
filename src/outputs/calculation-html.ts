// A design area's hydraulic calculation as HTML a reader follows: from the controlling head up to the source one
// pipe at a time, each pressure the one before plus friction and rise, then the flowing heads, nodes and pipes.

import type { AreaHydraulics } from '../hydraulics/calculate.js';
import { PRESSURE_BASIS } from '../hydraulics/velocity-pressure.js';
import type { Formatter } from '../quantities/format.js';
import { escapeHtml as esc } from './html-escape.js';

/** What the reader is shown beside node and head ids: the head on a node, by its id and handle. */
export interface HeadNames {
  /** Node id → "H29 (1B3)". */
  onNode: Map<string, string>;
  /** Handle → "H29". */
  byHandle: Map<string, string>;
}

/**
 * The calculation of one area. `title` names it; `open` shows it unfolded. Pressures to 0.01 psi (0.001 bar), so
 * that each step visibly adds up.
 */
export function calculationHtml(h: AreaHydraulics, title: string, open: boolean, fmt: Formatter, names: HeadNames): string {
  const f = fmt.cell;
  const u = fmt.unit;
  const controlling = h.heads.find((x) => x.handle === h.controllingHead);
  const nodeName = (id: string) => (names.onNode.has(id) ? `${id} · ${names.onNode.get(id)}` : id);
  // At the normal pressure, the side-outlet deduction of each step and each head's velocity and normal pressure.
  const normal = h.pressureBasis === 'normal';
  const sideCell = (v: number) => (normal ? `<td>${f.pressure(v)}</td>` : '');
  const stepRows = h.steps.map(
    (s, i) =>
      `<tr><td>${i + 1}</td><td>${esc(s.pipe)}</td><td>${esc(nodeName(s.from))} → ${esc(nodeName(s.to))}</td><td>${esc(s.nominalSize)}"</td>` +
      `<td>${f.diameter(s.innerDiameter)}</td><td>${f.length(s.length)}</td><td>${f.length(s.fittingsLength)}${s.fittings.length ? ` <small>${esc(s.fittings.join(', '))}</small>` : ''}</td>` +
      `<td>${s.cFactor}</td><td>${f.flow(s.flow)}</td><td>${f.perLength(s.frictionPerLength)}</td><td>${f.pressure(s.friction)}</td><td>${f.pressure(s.elevationChange)}</td>${sideCell(s.sideOutletDeduction)}` +
      `<td>${f.pressure(s.pressureFrom)}</td><td>${f.pressure(s.pressureTo)}</td><td>${f.velocity(s.velocity)}</td></tr>`,
  );
  const friction = h.steps.reduce((a, s) => a + s.friction, 0);
  const rise = h.steps.reduce((a, s) => a + s.elevationChange, 0);
  const side = h.steps.reduce((a, s) => a + s.sideOutletDeduction, 0);
  const start = h.steps[0]?.pressureFrom ?? controlling?.pressure ?? 0;
  const check =
    `<p class="sum">Friction ${f.pressure(friction)} + rise ${f.pressure(rise)}${normal ? ` + side outlets ${f.pressure(side)}` : ''} = ${f.pressure(friction + rise + side)} ${u.pressure}; ` +
    `source ${f.pressure(h.sourcePressure)} − controlling head ${f.pressure(start)} = ${f.pressure(h.sourcePressure - start)} ${u.pressure}.</p>`;
  const headRows = h.heads
    .map(
      (x) =>
        `<tr${x.handle === h.controllingHead ? ' class="controlling"' : ''}><td>${esc(names.byHandle.get(x.handle) ?? '')}</td><td>${esc(x.handle)}</td><td>${esc(x.node)}</td>` +
        `<td>${f.kFactor(x.kFactor)}</td><td>${f.pressure(x.requiredPressure)}</td><td>${f.pressure(x.pressure)}</td>${sideCell(x.velocityPressure)}${sideCell(x.normalPressure)}<td>${f.flow(x.flow)}</td></tr>`,
    )
    .join('');
  const nodeRows = h.nodes
    .map(
      (n) =>
        `<tr><td>${esc(n.id)}</td><td>${esc(names.onNode.get(n.id) ?? '')}</td><td>${f.pressure(n.pressure)}</td><td>${n.flow > 0 ? f.flow(n.flow) : ''}</td><td>${f.length(n.elevation)}</td></tr>`,
    )
    .join('');
  const pipeRows = h.pipes
    .map(
      (p) =>
        `<tr><td>${esc(p.id)}</td><td>${esc(p.from)} → ${esc(p.to)}</td><td>${esc(p.nominalSize)}"</td><td>${f.diameter(p.innerDiameter)}</td><td>${p.cFactor}</td>` +
        `<td>${f.flow(Math.abs(p.flow))}</td><td>${f.velocity(p.velocity)}</td><td>${f.perLength(p.frictionPerLength)}</td><td>${f.length(p.length - p.fittingsLength)}</td>` +
        `<td>${f.length(p.fittingsLength)}</td><td>${f.pressure(p.frictionLoss)}</td><td>${esc(p.fittings.join(', '))}</td></tr>`,
    )
    .join('');
  const riser =
    h.riser.modelled === 'virtual'
      ? ` The rise from the supply to the piping is the last step: a vertical ${esc(h.riser.nominalSize)}" pipe of ${esc(fmt.length(h.riser.length))}.`
      : '';
  const lead = controlling
    ? `<p>Controlling head ${esc(names.byHandle.get(controlling.handle) ?? '')} (handle ${esc(controlling.handle)}, node ${esc(controlling.node)}): ` +
      `it needs ${f.pressure(controlling.requiredPressure)} ${u.pressure}${normal ? ' of normal pressure' : ''} and gets exactly that; every other flowing head gets at least what it needs.${riser}</p>`
    : '';
  const basis = `<p class="basis">${esc(PRESSURE_BASIS[h.pressureBasis])}</p>`;
  const sideHead = (title: string) => (normal ? `<th>${title} (${u.pressure})</th>` : '');
  return `<details class="calc"${open ? ' open' : ''}><summary>${esc(title)}: ${esc(fmt.pressure(h.sourcePressure))} at ${esc(fmt.flow(h.sourceFlow))} at the source</summary>
${lead}${basis}<div class="scroll"><table class="steps"><thead><tr><th>step</th><th>pipe</th><th>from → to (against the flow)</th><th>size</th><th>inside Ø (${u.diameter})</th><th>length (${u.length})</th><th>fittings (${u.length})</th><th>C</th><th>flow (${u.flow})</th><th>friction (${u.perLength})</th><th>friction (${u.pressure})</th><th>rise (${u.pressure})</th>${sideHead('side outlet: velocity pressure')}<th>pressure at from (${u.pressure})</th><th>pressure at to (${u.pressure})</th><th>velocity (${u.velocity})</th></tr></thead><tbody>${stepRows.join('')}</tbody></table></div>
${check}
<details><summary>Flowing heads (${h.heads.length})</summary><div class="scroll"><table><thead><tr><th>head</th><th>handle</th><th>node</th><th>K (${u.kFactor})</th><th>needs (${u.pressure})</th><th>gets, total (${u.pressure})</th>${sideHead('velocity pressure')}${sideHead('normal')}<th>flow (${u.flow})</th></tr></thead><tbody>${headRows}</tbody></table></div></details>
<details><summary>Nodes (${h.nodes.length})</summary><div class="scroll"><table><thead><tr><th>node</th><th>head</th><th>pressure (${u.pressure})</th><th>flow out (${u.flow})</th><th>elevation (${u.length})</th></tr></thead><tbody>${nodeRows}</tbody></table></div></details>
<details><summary>Pipes (${h.pipes.length})</summary><div class="scroll"><table><thead><tr><th>pipe</th><th>from → to</th><th>size</th><th>inside Ø (${u.diameter})</th><th>C</th><th>flow (${u.flow})</th><th>velocity (${u.velocity})</th><th>friction (${u.perLength})</th><th>length (${u.length})</th><th>fittings (${u.length})</th><th>friction (${u.pressure})</th><th>fittings</th></tr></thead><tbody>${pipeRows}</tbody></table></div></details>
</details>`;
}
