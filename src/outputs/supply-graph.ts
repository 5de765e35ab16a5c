// The water-supply graph of the report as inline SVG: pressure against flow on the customary Q^1.85
// abscissa, where a flow-test supply is a straight line (and the supply at the source after its path a curve
// beside it); each design area's demand with and without hose.

import type { SupplyAtSource } from '../hydraulics/supply-path.js';
import { availablePressure, flowAtZeroPressure, type FlowTest } from '../hydraulics/water-supply.js';
import type { Converter, ReportUnits } from '../quantities/convert.js';
import { escapeHtml as esc } from './html-escape.js';
import { placeLabels } from '../geometry/labels.js';

export interface DemandPoint {
  label: string;
  flow: number;
  withHose: number;
  pressure: number;
}

/** A round step near `raw` (1, 2 or 5 times a power of ten). */
function niceStep(raw: number): number {
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
}

export function supplyGraph(
  supply: FlowTest | undefined,
  atSource: SupplyAtSource | null,
  demands: DemandPoint[],
  c: Converter,
  u: ReportUnits,
): string {
  const W = 720,
    H = 380,
    L = 60,
    R = 20,
    T = 20,
    B = 50;
  const pw = W - L - R,
    ph = H - T - B;
  const qMax = Math.max(supply ? supply.flow * 1.5 : 0, ...demands.map((d) => d.withHose * 1.25), 1);
  const pMax = Math.max(supply?.static ?? 0, atSource?.hasPath ? atSource.available(0) : 0, ...demands.map((d) => d.pressure), 1) * 1.1;
  const x = (q: number) => L + (Math.max(0, q) / qMax) ** 1.85 * pw;
  const y = (p: number) => T + ph - (Math.max(0, p) / pMax) * ph;
  const parts: string[] = [];
  const qStep = niceStep(c.flow(qMax) / 8);
  for (let q = qStep; q <= c.flow(qMax) + 1e-9; q += qStep) {
    const X = x(q / c.flow(1));
    parts.push(
      `<line class="grid" x1="${X.toFixed(1)}" y1="${T}" x2="${X.toFixed(1)}" y2="${T + ph}"/><text x="${X.toFixed(1)}" y="${T + ph + 14}" text-anchor="middle">${+q.toPrecision(6)}</text>`,
    );
  }
  const pStep = niceStep(c.pressure(pMax) / 6);
  for (let p = 0; p <= c.pressure(pMax) + 1e-9; p += pStep) {
    const Y = y(p / c.pressure(1));
    parts.push(
      `<line class="grid" x1="${L}" y1="${Y.toFixed(1)}" x2="${L + pw}" y2="${Y.toFixed(1)}"/><text x="${L - 6}" y="${(Y + 4).toFixed(1)}" text-anchor="end">${+p.toPrecision(6)}</text>`,
    );
  }
  parts.push(
    `<line class="axis" x1="${L}" y1="${T + ph}" x2="${L + pw}" y2="${T + ph}"/><line class="axis" x1="${L}" y1="${T}" x2="${L}" y2="${T + ph}"/>`,
  );
  parts.push(`<text x="${L + pw / 2}" y="${H - 8}" text-anchor="middle">flow (${esc(u.flow)}), scale Q^1.85</text>`);
  parts.push(`<text transform="translate(14 ${T + ph / 2}) rotate(-90)" text-anchor="middle">pressure (${esc(u.pressure)})</text>`);
  if (supply) {
    // Straight on this abscissa: from the static pressure at no flow to where the line meets zero or the edge.
    const qEnd = Math.min(qMax, flowAtZeroPressure(supply));
    parts.push(
      `<line class="supply" x1="${x(0).toFixed(1)}" y1="${y(supply.static).toFixed(1)}" x2="${x(qEnd).toFixed(1)}" y2="${y(availablePressure(supply, qEnd)).toFixed(1)}"><title>supply: ${c.pressure(supply.static).toFixed(2)} static, ${c.pressure(supply.residual).toFixed(2)} at ${c.flow(supply.flow).toFixed(0)}</title></line>`,
    );
    parts.push(`<circle class="test" cx="${x(supply.flow).toFixed(1)}" cy="${y(supply.residual).toFixed(1)}" r="3.5" fill="#1f6fd1"/>`);
  }
  const curveLabels: { text: string; at: { x: number; y: number } }[] = [];
  if (supply && atSource?.hasPath) {
    // The supply at the source, sampled evenly on the Q^1.85 axis (a pump or a device bends it).
    const samples = Array.from({ length: 61 }, (_, i) => qMax * (i / 60) ** (1 / 1.85));
    const pts = samples.map((q) => `${x(q).toFixed(1)},${y(atSource.available(q)).toFixed(1)}`).join(' ');
    parts.push(`<polyline class="supply-source" points="${pts}"><title>supply at the source, after the supply path</title></polyline>`);
    curveLabels.push({ text: 'flow test', at: { x: x(0), y: y(supply.static) } });
    curveLabels.push({ text: 'at the source, after the path', at: { x: x(0), y: y(atSource.available(0)) } });
  }
  // Labels beside their with-hose point, moved where they would overprint another label or a point.
  const points = demands.flatMap((d) => [
    { x: x(d.flow), y: y(d.pressure) },
    { x: x(d.withHose), y: y(d.pressure) },
  ]);
  const labels = [
    ...demands.map((d) => ({ text: d.label, at: { x: x(d.withHose), y: y(d.pressure) } })),
    ...curveLabels.map((l) => ({ text: l.text, at: { x: l.at.x + 6, y: l.at.y } })),
  ];
  const placed = placeLabels(
    labels.map((l) => ({ at: l.at, width: 6.2 * l.text.length, height: 12 })),
    [
      ...points.map((q) => ({ minX: q.x - 4, minY: q.y - 4, maxX: q.x + 4, maxY: q.y + 4 })),
      // outside the plot: the axis labels' side, above and beyond the right edge
      { minX: -1e6, minY: -1e6, maxX: L, maxY: 1e6 },
      { minX: W - 2, minY: -1e6, maxX: 1e6, maxY: 1e6 },
      { minX: -1e6, minY: -1e6, maxX: 1e6, maxY: 0 },
      { minX: -1e6, minY: T + ph, maxX: 1e6, maxY: 1e6 },
    ],
    4,
  );
  demands.forEach((d, i) => {
    parts.push(
      `<line class="hose" x1="${x(d.flow).toFixed(1)}" y1="${y(d.pressure).toFixed(1)}" x2="${x(d.withHose).toFixed(1)}" y2="${y(d.pressure).toFixed(1)}"/>`,
    );
    parts.push(
      `<circle class="demand" cx="${x(d.flow).toFixed(1)}" cy="${y(d.pressure).toFixed(1)}" r="4"><title>${esc(d.label)}: ${c.pressure(d.pressure).toFixed(2)} at ${c.flow(d.flow).toFixed(1)}</title></circle>`,
    );
    parts.push(`<circle class="demand" cx="${x(d.withHose).toFixed(1)}" cy="${y(d.pressure).toFixed(1)}" r="3" fill-opacity="0.5"/>`);
    const b = placed[i]!;
    if (b.moved) {
      const toX = Math.min(Math.max(x(d.withHose), b.minX), b.maxX);
      parts.push(
        `<line class="leader" x1="${x(d.withHose).toFixed(1)}" y1="${y(d.pressure).toFixed(1)}" x2="${toX.toFixed(1)}" y2="${(b.minY + 6).toFixed(1)}"/>`,
      );
    }
    parts.push(`<text class="demand-label" x="${b.minX.toFixed(1)}" y="${(b.maxY - 2).toFixed(1)}">${esc(d.label)}</text>`);
  });
  curveLabels.forEach((l, i) => {
    const b = placed[demands.length + i]!;
    parts.push(`<text class="curve-label" x="${b.minX.toFixed(1)}" y="${(b.maxY - 2).toFixed(1)}">${esc(l.text)}</text>`);
  });
  return `<svg class="chart" id="supply" viewBox="0 0 ${W} ${H}" role="img" aria-label="water supply graph" xmlns="http://www.w3.org/2000/svg">${parts.join('')}</svg>`;
}
