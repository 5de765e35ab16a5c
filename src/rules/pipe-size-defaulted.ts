// Rule pipe-size-defaulted: pipe with no size label near it was given the configured default size; the hydraulic
// result rests on that assumption, so the reviewer is told (warning), once per drawn entity, quoting any label
// beside it that reads like a size but names none.

import type { NetPipe } from '../network/types.js';
import { finding, type Rule } from './types.js';

export const pipeSizeDefaulted: Rule<'pipe-size-defaulted'> = {
  meta: {
    id: 'pipe-size-defaulted',
    title: 'Pipe size assumed',
    severity: 'warning',
    reference: 'common practice, no source: pipe sizes are labelled on sprinkler working plans',
  },
  check({ network, settings }) {
    const byEntity = new Map<string, NetPipe[]>();
    for (const p of network.pipes.filter((x) => x.sizeFrom === 'default')) {
      const key = p.handles.join(',');
      byEntity.set(key, [...(byEntity.get(key) ?? []), p]);
    }
    return [...byEntity.values()].map((pipes) => {
      const first = pipes[0]!;
      return finding(this.meta, {
        params: {
          pipes: pipes.map((p) => p.id),
          size: first.nominalSize,
          reach: settings.tolerances.sizeLabel,
          unreadLabels: [...new Set(pipes.flatMap((p) => p.unreadLabels))],
        },
        handles: [...new Set(pipes.flatMap((p) => p.handles))],
        at: first.points[Math.floor(first.points.length / 2)]!,
        measured: pipes.length,
        quantity: 'count',
      });
    });
  },
};
