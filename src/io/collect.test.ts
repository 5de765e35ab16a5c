// Collections between stages: only where the heap has grown large, and they do free what is garbage.

import { describe, expect, it } from 'vitest';
import { getHeapStatistics } from 'node:v8';
import { collectBetweenStages } from './collect.js';

describe('collectBetweenStages', () => {
  it('frees what became garbage at a collection point once the heap is large, and only there', () => {
    const hook = collectBetweenStages();
    let held: number[][] | null = Array.from({ length: 200 }, () => Array.from({ length: 50_000 }, (_, k) => k + 0.5));
    expect(held.length).toBe(200);
    held = null; // now garbage, and the heap is over 64 MiB
    const before = getHeapStatistics().used_heap_size;
    hook('read'); // not a collection point
    expect(getHeapStatistics().used_heap_size).toBeGreaterThan(before - 40 * 2 ** 20);
    hook('plan');
    const after = getHeapStatistics().used_heap_size;
    // 200 arrays of 50,000 doubles are 80 MB (8 bytes each: from memory, V8 keeps packed doubles unboxed); most must be gone.
    expect(before - after).toBeGreaterThan(40 * 2 ** 20);
  });

  it('does nothing while the heap is small (a small check pays no collection)', () => {
    const hook = collectBetweenStages();
    if (getHeapStatistics().used_heap_size > 64 * 2 ** 20) hook('plan'); // settle what the test above left
    const before = getHeapStatistics().used_heap_size;
    expect(before).toBeLessThan(64 * 2 ** 20);
    let small: number[] | null = Array.from({ length: 100_000 }, (_, k) => k + 0.5);
    expect(small.length).toBe(100_000);
    small = null;
    const grown = getHeapStatistics().used_heap_size;
    hook('plan');
    // no full collection ran: the 800 kB of garbage is still counted
    expect(getHeapStatistics().used_heap_size).toBeGreaterThan(grown - 400_000);
  });
});
