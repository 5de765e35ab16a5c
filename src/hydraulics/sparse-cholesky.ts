// A sparse symmetric positive-definite solver for the network equations: reverse Cuthill-McKee ordering,
// then an envelope (profile) Cholesky factorisation. The structure is fixed once; values change per solve.

export class EnvelopeSystem {
  readonly n: number;
  /** perm[k] = original index at position k; pos[i] = position of original index i. */
  private readonly perm: Int32Array;
  private readonly pos: Int32Array;
  private readonly first: Int32Array;
  private readonly rowStart: Int32Array;
  private readonly values: Float64Array;

  /** @param edges pairs of original indices with a non-zero off-diagonal entry */
  constructor(n: number, edges: readonly (readonly [number, number])[]) {
    this.n = n;
    const adj: number[][] = Array.from({ length: n }, () => []);
    const pairs = new Set<string>();
    for (const [a, b] of edges) {
      const key = a < b ? `${a},${b}` : `${b},${a}`;
      if (a !== b && !pairs.has(key)) { pairs.add(key); adj[a]!.push(b); adj[b]!.push(a); }
    }
    this.perm = reverseCuthillMcKee(adj);
    this.pos = new Int32Array(n);
    this.perm.forEach((orig, k) => { this.pos[orig] = k; });
    this.first = new Int32Array(n);
    this.rowStart = new Int32Array(n + 1);
    for (let k = 0; k < n; k++) {
      let f = k;
      for (const nb of adj[this.perm[k]!]!) f = Math.min(f, this.pos[nb]!);
      this.first[k] = f;
      this.rowStart[k + 1] = this.rowStart[k]! + (k - f + 1);
    }
    this.values = new Float64Array(this.rowStart[n]!);
  }

  /** Entries stored (the profile), a measure of the factorisation's cost. */
  get profile(): number {
    return this.values.length;
  }

  clear(): void {
    this.values.fill(0);
  }

  /** Adds v to entry (i, j) and (j, i) of the matrix, original indices. */
  add(i: number, j: number, v: number): void {
    let r = this.pos[i]!;
    let c = this.pos[j]!;
    if (c > r) [r, c] = [c, r];
    this.values[this.rowStart[r]! + (c - this.first[r]!)]! += v;
  }

  /** Factorises in place and solves A·x = b (original indices). Throws if A is not positive definite. */
  solve(b: Float64Array): Float64Array {
    const { n, first, rowStart, values: L } = this;
    for (let i = 0; i < n; i++) {
      const fi = first[i]!;
      const ri = rowStart[i]! - fi;
      for (let j = fi; j < i; j++) {
        const fj = first[j]!;
        const rj = rowStart[j]! - fj;
        let s = L[ri + j]!;
        for (let k = Math.max(fi, fj); k < j; k++) s -= L[ri + k]! * L[rj + k]!;
        L[ri + j] = s / L[rj + j]!;
      }
      let d = L[ri + i]!;
      for (let k = fi; k < i; k++) d -= L[ri + k]! * L[ri + k]!;
      if (!(d > 0)) throw new Error('network matrix is not positive definite (a part of the network has no fixed pressure)');
      L[ri + i] = Math.sqrt(d);
    }
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const fi = first[i]!;
      const ri = rowStart[i]! - fi;
      let s = b[this.perm[i]!]!;
      for (let k = fi; k < i; k++) s -= L[ri + k]! * y[k]!;
      y[i] = s / L[ri + i]!;
    }
    for (let i = n - 1; i >= 0; i--) {
      const fi = first[i]!;
      const ri = rowStart[i]! - fi;
      y[i] = y[i]! / L[ri + i]!;
      for (let k = fi; k < i; k++) y[k] = y[k]! - L[ri + k]! * y[i]!;
    }
    const x = new Float64Array(n);
    for (let k = 0; k < n; k++) x[this.perm[k]!] = y[k]!;
    return x;
  }
}

/** Reverse Cuthill-McKee order of a graph (each component from a low-degree start), as original indices. */
function reverseCuthillMcKee(adj: number[][]): Int32Array {
  const n = adj.length;
  const seen = new Uint8Array(n);
  const order: number[] = [];
  const byDegree = [...Array(n).keys()].sort((a, b) => adj[a]!.length - adj[b]!.length);
  for (const start of byDegree) {
    if (seen[start]) continue;
    seen[start] = 1;
    const queue = [start];
    for (let q = 0; q < queue.length; q++) {
      const v = queue[q]!;
      order.push(v);
      const next = adj[v]!.filter((w) => !seen[w]).sort((a, b) => adj[a]!.length - adj[b]!.length);
      for (const w of next) if (!seen[w]) { seen[w] = 1; queue.push(w); }
    }
  }
  return Int32Array.from(order.reverse());
}
