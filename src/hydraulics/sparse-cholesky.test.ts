// The sparse LDLᵀ solver against a dense reference (Gaussian elimination, textbook method) on
// random symmetric positive-definite graph Laplacians with a grounded node (common practice, no source).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SparseSpdSystem } from './sparse-cholesky.js';

function denseSolve(a: number[][], b: number[]): number[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]!]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r]![c]!) > Math.abs(m[p]![c]!)) p = r;
    [m[c], m[p]] = [m[p]!, m[c]!];
    for (let r = c + 1; r < n; r++) {
      const f = m[r]![c]! / m[c]![c]!;
      for (let k = c; k <= n; k++) m[r]![k]! -= f * m[c]![k]!;
    }
  }
  const x = new Array(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r]![n]!;
    for (let k = r + 1; k < n; k++) s -= m[r]![k]! * x[k];
    x[r] = s / m[r]![r]!;
  }
  return x;
}

/** A random connected network of n unknowns: a random tree and up to n/2 more edges (no loops), and the generator. */
function randomNetwork(n: number, seed: number): { rnd: () => number; edges: [number, number][] } {
  let s = seed;
  const rnd = () => (s = (s * 1103515245 + 12345) % 2147483648) / 2147483648;
  const edges: [number, number][] = [];
  for (let i = 1; i < n; i++) edges.push([i, Math.floor(rnd() * i)]);
  for (let e = 0; e < n / 2; e++) {
    const a = Math.floor(rnd() * n);
    const b = Math.floor(rnd() * n);
    if (a !== b) edges.push([a, b]);
  }
  return { rnd, edges };
}

describe('SparseSpdSystem', () => {
  it('solves random grounded Laplacians like dense elimination', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 25 }), fc.integer({ min: 0, max: 1_000_000 }), (n, seed) => {
        const { rnd, edges } = randomNetwork(n, seed);
        const sys = new SparseSpdSystem(n, edges);
        const dense = Array.from({ length: n }, () => new Array(n).fill(0));
        for (const [a, b] of edges) {
          const w = 0.1 + rnd() * 10;
          sys.add(a, a, w);
          sys.add(b, b, w);
          sys.add(a, b, -w);
          dense[a]![a] += w;
          dense[b]![b] += w;
          dense[a]![b] -= w;
          dense[b]![a] -= w;
        }
        sys.add(0, 0, 1);
        dense[0]![0] += 1; // grounded: positive definite
        const b = Array.from({ length: n }, () => rnd() * 2 - 1);
        const x = sys.solve(Float64Array.from(b));
        const ref = denseSolve(dense, b);
        ref.forEach((v, i) => {
          expect(x[i]).toBeCloseTo(v, 6);
        });
      }),
      { numRuns: 60 },
    );
  });

  it('solves a part nothing couples to the rest alone: the same numbers as the whole system with the rest idle, the rest untouched', () => {
    fc.assert(
      fc.property(fc.integer({ min: 3, max: 25 }), fc.integer({ min: 0, max: 1_000_000 }), (n, seed) => {
        const { rnd, edges } = randomNetwork(n, seed);
        const sys = new SparseSpdSystem(n, edges);
        // A first solve of the whole system leaves its values behind, as a solve of another live part would.
        for (const [a, b] of edges) sys.add(a, b, -1 - rnd());
        for (let i = 0; i < n; i++) sys.add(i, i, 2 * n);
        sys.solve(Float64Array.from({ length: n }, () => rnd()));
        // The live part, as a network's: connected to unknown 0 (grounded) through the tree's edges, each unknown
        // live with its parent at even odds; only edges within it carry entries.
        const live: boolean[] = [true];
        for (let i = 1; i < n; i++) live.push(live[edges[i - 1]![1]]! && rnd() < 0.5);
        const inside = edges.filter(([a, b]) => live[a] && live[b]).map(([a, b]) => [a, b, 0.1 + rnd() * 10] as const);
        const fill = (m: SparseSpdSystem, idle: boolean) => {
          for (const [a, b, w] of inside) {
            m.add(a, a, w);
            m.add(b, b, w);
            m.add(a, b, -w);
          }
          m.add(0, 0, 1);
          if (idle) for (let i = 0; i < n; i++) if (!live[i]) m.add(i, i, 1);
        };
        const b = Float64Array.from({ length: n }, (_, i) => (live[i] ? rnd() * 2 - 1 : 0));
        const columns = sys.columnsOf(live.flatMap((on, i) => (on ? [i] : [])));
        sys.clear(columns);
        fill(sys, false);
        const out = new Float64Array(n).fill(-7);
        sys.solve(b, out, columns);
        const whole = new SparseSpdSystem(n, edges);
        fill(whole, true);
        const reference = whole.solve(b);
        for (let i = 0; i < n; i++) expect(out[i]).toBe(live[i] ? reference[i] : -7);
      }),
      { numRuns: 60 },
    );
  });

  it('refuses a singular system (an island without a fixed pressure)', () => {
    const sys = new SparseSpdSystem(2, [[0, 1]]);
    sys.add(0, 0, 1);
    sys.add(1, 1, 1);
    sys.add(0, 1, -1);
    expect(() => sys.solve(new Float64Array([1, -1]))).toThrow(/not positive definite/);
  });
});
