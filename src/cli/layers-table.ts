// The `headcheck layers` table: each layer, its entity counts by type and the role the tool gives it,
// so a user can write the `layers` part of a config in a minute.

import { LAYER_ROLES, type Settings } from '../config/settings.js';
import { planFromDrawing } from '../read/plan.js';
import { readDrawing } from '../read/read-drawing.js';

export function describeLayers(bytes: Uint8Array, settings: Settings): string {
  const drawing = readDrawing(bytes, { layers: settings.layers, limits: settings.inputLimits, ...(settings.units ? { units: settings.units } : {}) });
  const { roles } = planFromDrawing(drawing, settings);
  const roleOf = new Map<string, string>();
  for (const role of LAYER_ROLES) for (const l of roles[role].layers) roleOf.set(l, role);
  const rows = drawing.layers.map((l) => [
    l.name,
    roleOf.get(l.name) ?? '-',
    Object.entries(l.counts).sort(([a], [b]) => a.localeCompare(b)).map(([t, n]) => `${t} ${n}`).join(', ') || '(empty)',
  ]);
  const header = ['layer', 'role', 'entities'];
  const width = [0, 1].map((i) => Math.max(header[i]!.length, ...rows.map((r) => r[i]!.length)));
  const line = (r: string[]) => `${r[0]!.padEnd(width[0]!)}  ${r[1]!.padEnd(width[1]!)}  ${r[2]}`;
  const why = LAYER_ROLES.map((role) => `  ${role}: ${roles[role].layers.join(', ') || '(none)'} (${roles[role].from}: ${roles[role].reason})`);
  return [
    `drawing: ${drawing.version}, units ${drawing.units} (from ${drawing.unitsFrom}), encoding ${drawing.encoding}`,
    line(header), ...rows.map(line), 'roles:', ...why,
  ].join('\n');
}
