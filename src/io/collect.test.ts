// Collections between stages: reachable on this Node, only for large drawings, and they do free what is garbage.

import { describe, expect, it } from 'vitest';
import { collectBetweenStages } from './collect.js';

describe('collectBetweenStages', () => {
  it('gives no hook for a small drawing', () => {
    expect(collectBetweenStages(100_000)).toBeUndefined();
  });

  it('gives a hook for a large one that frees what became garbage at a collection point', () => {
    const hook = collectBetweenStages(8 * 2 ** 20)!;
    expect(typeof hook).toBe('function');
    let held: number[][] | null = Array.from({ length: 200 }, () => Array.from({ length: 50_000 }, (_, k) => k + 0.5));
    const before = process.memoryUsage().heapUsed;
    expect(held.length).toBe(200);
    held = null; // now garbage
    hook('read'); // not a collection point
    hook('plan');
    const after = process.memoryUsage().heapUsed;
    // 200 arrays of 50,000 doubles are 80 MB (8 bytes each: from memory, V8 keeps packed doubles unboxed); most must be gone.
    expect(before - after).toBeGreaterThan(40 * 2 ** 20);
  });
});
