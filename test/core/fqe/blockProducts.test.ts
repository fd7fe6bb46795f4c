/**
 * The block cross products of the Bellman statistics' pass (blockProducts.ts), by the WebAssembly
 * SIMD kernel and by the scalar tiles, against the plain route: one dot product per entry, summed
 * row by row from +0, then added to the total. Both routes add the same products in the same order
 * (IEEE 754 round-to-nearest per operation; WebAssembly's f64x2.mul and f64x2.add are the scalar
 * f64.mul and f64.add lane by lane, WebAssembly Core Specification 2.0, §4.3.3), so the check is
 * bit for bit — Object.is, so a −0 against +0 would fail too. Feature counts from 1 to 57 cover
 * every edge of the 2×8 and 3×3 tiles; a short block (fewer rows than it holds) and sums that start
 * away from zero are covered as well.
 */
import { describe, expect, it } from 'vitest';
import { createBlockProducts, type BlockProducts } from '../../../src/core/fqe/blockProducts';
import { simdTile, tileModuleBytes } from '../../../src/core/fqe/productKernel';

function filled(p: BlockProducts, seed: number): BlockProducts {
  let s = seed;
  const next = () => (s = (s * 16807) % 2147483647) / 2147483647 - 0.5;
  for (let k = 0; k < p.rows * p.d; k++) {
    p.phi[k] = next() * 10 ** Math.round(6 * next());
    p.psi[k] = next();
  }
  return p;
}

/** out[o + i·d + j] += Σ_t x[t·d + i]·y[t·d + j], one entry at a time. */
function plain(x: Float64Array, y: Float64Array, d: number, size: number, out: Float64Array, o: number, upper: boolean): void {
  for (let i = 0; i < d; i++) {
    for (let j = upper ? i : 0; j < d; j++) {
      let s = 0;
      for (let t = 0; t < size; t++) s += x[t * d + i] * y[t * d + j];
      out[o + i * d + j] += s;
    }
  }
}

function sameBits(a: Float64Array, b: Float64Array): boolean {
  return a.length === b.length && a.every((v, k) => Object.is(v, b[k]));
}

describe('block cross products', () => {
  it('compiles the SIMD kernel on this host (Node’s V8 has WebAssembly SIMD)', () => {
    expect(WebAssembly.validate(tileModuleBytes())).toBe(true);
    expect(simdTile(new WebAssembly.Memory({ initial: 1 }))).not.toBeNull();
    expect(createBlockProducts(35, 64).route).toBe('simd');
  });

  it.each(['simd', 'scalar'] as const)('%s route: every feature count 1–57, G and H upper, M whole, equal the plain sums to the bit', (route) => {
    for (let d = 1; d <= 57; d++) {
      const rows = 40, p = filled(createBlockProducts(d, rows, route), d), dd = d * d;
      expect(p.route).toBe(route);
      const fast = new Float64Array(3 * dd).fill(0.25), reference = new Float64Array(3 * dd).fill(0.25);
      for (const size of [rows, 17, 1]) {
        p.add(p.phi, p.phi, size, fast, 0, true);
        p.add(p.phi, p.psi, size, fast, dd, false);
        p.add(p.psi, p.psi, size, fast, 2 * dd, true);
        plain(p.phi, p.phi, d, size, reference, 0, true);
        plain(p.phi, p.psi, d, size, reference, dd, false);
        plain(p.psi, p.psi, d, size, reference, 2 * dd, true);
      }
      expect(sameBits(fast, reference), `d = ${d}`).toBe(true);
    }
  });

  it('leaves the entries below the diagonal of an upper sum alone', () => {
    for (const route of ['simd', 'scalar'] as const) {
      const d = 11, p = filled(createBlockProducts(d, 30, route), 3), out = new Float64Array(d * d);
      p.add(p.phi, p.phi, 30, out, 0, true);
      for (let i = 0; i < d; i++) for (let j = 0; j < i; j++) expect(out[i * d + j]).toBe(0);
    }
  });
});
