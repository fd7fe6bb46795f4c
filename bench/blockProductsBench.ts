/**
 * The block cross products of the Bellman statistics' data pass (src/core/fqe/blockProducts.ts)
 * by its two routes — the WebAssembly SIMD kernel (2×8 tiles) and the scalar 3×3 tiles — beside a
 * plain dot product per entry, all summing each entry in the same order (so the same numbers,
 * checked here too). For d = 10, 35 and 56 features (polynomial degrees 2, 4 and 5 in three inputs)
 * on blocks of 1,024 rows: G and H (upper) and M of a block, the CPU time of this process
 * (process.cpuUsage) per 1,000,000 rows, the three routes alternated three times, and the ratios.
 * Printed, never asserted.
 *   npm run bench -- block-products
 */
import { createBlockProducts, type BlockProducts } from '../src/core/fqe/blockProducts';

const ROWS = 1024;

function cpuSeconds(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
}

/** G (upper), M, H (upper) of the block into out (3d²). */
function routeSums(p: BlockProducts, out: Float64Array): void {
  const dd = p.d * p.d;
  p.add(p.phi, p.phi, ROWS, out, 0, true);
  p.add(p.phi, p.psi, ROWS, out, dd, false);
  p.add(p.psi, p.psi, ROWS, out, 2 * dd, true);
}

function plainSums(p: BlockProducts, out: Float64Array): void {
  const { d, phi, psi } = p, dd = d * d, dot = (x: Float64Array, i: number, y: Float64Array, j: number) => {
    let s = 0;
    for (let t = 0; t < ROWS; t++) s += x[t * d + i] * y[t * d + j];
    return s;
  };
  for (let i = 0; i < d; i++) {
    for (let j = 0; j < d; j++) {
      if (j >= i) out[i * d + j] += dot(phi, i, phi, j);
      out[dd + i * d + j] += dot(phi, i, psi, j);
      if (j >= i) out[2 * dd + i * d + j] += dot(psi, i, psi, j);
    }
  }
}

function cpuPer(sums: (out: Float64Array) => void, d: number, blocks: number): { seconds: number; out: Float64Array } {
  const out = new Float64Array(3 * d * d);
  sums(out); // warm
  out.fill(0);
  const start = cpuSeconds();
  for (let k = 0; k < blocks; k++) sums(out);
  return { seconds: (cpuSeconds() - start) / blocks, out };
}

export function runBlockProductsBench(): Record<string, string | number> {
  const figures: Record<string, string | number> = { 'rows per block': ROWS };
  let seed = 7;
  const uniform = () => (seed = (seed * 16807) % 2147483647) / 2147483647 - 0.5;
  for (const d of [10, 35, 56]) {
    const simd = createBlockProducts(d, ROWS), scalar = createBlockProducts(d, ROWS, 'scalar');
    for (let k = 0; k < ROWS * d; k++) {
      simd.phi[k] = scalar.phi[k] = uniform();
      simd.psi[k] = scalar.psi[k] = uniform();
    }
    const blocks = Math.max(20, Math.round(4e8 / (ROWS * d * d)));
    const runs = { simd: [] as number[], scalar: [] as number[], plain: [] as number[] };
    let same = true;
    for (let rep = 0; rep < 3; rep++) {
      const v = cpuPer((out) => routeSums(simd, out), d, blocks), s = cpuPer((out) => routeSums(scalar, out), d, blocks);
      const p = cpuPer((out) => plainSums(scalar, out), d, blocks);
      runs.simd.push(v.seconds);
      runs.scalar.push(s.seconds);
      runs.plain.push(p.seconds);
      same &&= v.out.every((x, k) => Object.is(x, p.out[k])) && s.out.every((x, k) => Object.is(x, p.out[k]));
    }
    const perMillion = (s: number[]) => s.map((v) => (v * (1e6 / ROWS)).toFixed(2)).join(', ');
    const ratio = (a: number[], b: number[]) => a.map((v, i) => (v / b[i]).toFixed(2)).join(', ');
    figures[`d = ${d}: ${simd.route}, CPU s per 1e6 rows`] = perMillion(runs.simd);
    figures[`d = ${d}: scalar tiles, CPU s per 1e6 rows`] = perMillion(runs.scalar);
    figures[`d = ${d}: plain, CPU s per 1e6 rows`] = perMillion(runs.plain);
    figures[`d = ${d}: ${simd.route} / scalar tiles`] = ratio(runs.simd, runs.scalar);
    figures[`d = ${d}: both equal plain to the bit`] = same ? 'yes' : 'NO';
  }
  return figures;
}
