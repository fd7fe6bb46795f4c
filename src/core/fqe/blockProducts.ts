/**
 * The cross products of one block of rows, added to a d×d sum:
 *   out[o + i·d + j] += Σ_{t<size} x[t·d + i]·y[t·d + j]      (every i, j; or j ≥ i only: `upper`)
 * for the two row-major blocks the Bellman statistics' pass gathers (phi, psi: B rows of d).
 *
 * Each entry is summed over the rows in order, one product at a time, from +0, and then added to
 * out once: the same additions in the same order as a plain dot product per entry, so the same
 * numbers to the last bit, by either route:
 *   simd   — 2×8 tiles by a WebAssembly SIMD kernel (productKernel.ts), the blocks in its memory;
 *            about three to four times the scalar route's speed on V8 (bench/blockProductsBench.ts);
 *   scalar — 3×3 register tiles in JavaScript, where the host has no WebAssembly SIMD.
 * A tile's rows or columns past the last feature read padding or the next row and are not written.
 *
 * Shapes: phi, psi B×d row-major (feature f of row t at t·d + f); out d×d row-major at offset o.
 */
import { simdTile, type SimdTile } from './productKernel';

export type ProductRoute = 'simd' | 'scalar';

export interface BlockProducts {
  readonly route: ProductRoute;
  readonly d: number;
  readonly rows: number; // B
  readonly phi: Float64Array; // B×d, then padding
  readonly psi: Float64Array; // B×d, then padding
  /** out[o + i·d + j] += Σ_{t<size} x[t·d + i]·y[t·d + j] over the first `size` rows; `upper`: j ≥ i only. */
  add(x: Float64Array, y: Float64Array, size: number, out: Float64Array, o: number, upper: boolean): void;
}

/** Columns one SIMD tile spans (four pairs), and the padding after each block so its last row's tile reads inside the memory. */
const TILE_COLUMNS = 8;
const PAD = TILE_COLUMNS;
const BYTES = 8;

/** Blocks for d features and B rows: in a WebAssembly memory with the SIMD kernel where the host has one (unless `route` says otherwise). */
export function createBlockProducts(d: number, rows: number, route: ProductRoute = 'simd'): BlockProducts {
  const length = rows * d + PAD;
  if (route === 'simd' && typeof WebAssembly === 'object') {
    const bytes = (2 * length + 2 * TILE_COLUMNS) * BYTES;
    const memory = new WebAssembly.Memory({ initial: Math.ceil(bytes / 65536) });
    const tile = simdTile(memory);
    if (tile) return simdProducts(d, rows, memory, tile, length);
  }
  return scalarProducts(d, rows, new Float64Array(length), new Float64Array(length));
}

function simdProducts(d: number, rows: number, memory: WebAssembly.Memory, tile: SimdTile, length: number): BlockProducts {
  const phi = new Float64Array(memory.buffer, 0, length), psi = new Float64Array(memory.buffer, length * BYTES, length);
  const resAt = 2 * length * BYTES, res = new Float64Array(memory.buffer, resAt, 2 * TILE_COLUMNS), stride = d * BYTES, last = d - 1;
  return {
    route: 'simd', d, rows, phi, psi,
    add(x, y, size, out, o, upper) {
      if (size <= 0) return;
      if (x.buffer !== memory.buffer || y.buffer !== memory.buffer) throw new RangeError('BlockProducts.add: x and y must be this block’s phi or psi');
      const xAt = x.byteOffset, yAt = y.byteOffset;
      for (let i = 0; i < d; i += 2) {
        const i1 = Math.min(i + 1, last);
        for (let j = upper ? i : 0; j < d; j += TILE_COLUMNS) {
          tile(xAt + i * BYTES, xAt + i1 * BYTES, yAt + j * BYTES, stride, size, resAt);
          const columns = Math.min(TILE_COLUMNS, d - j);
          for (let c = 0; c < columns; c++) {
            if (!upper || j + c >= i) out[o + i * d + j + c] += res[c];
            if (i1 !== i && (!upper || j + c >= i1)) out[o + i1 * d + j + c] += res[TILE_COLUMNS + c];
          }
        }
      }
    },
  };
}

function scalarProducts(d: number, rows: number, phi: Float64Array, psi: Float64Array): BlockProducts {
  const last = d - 1;
  return {
    route: 'scalar', d, rows, phi, psi,
    add(x, y, size, out, o, upper) {
      for (let i = 0; i < d; i += 3) {
        const i1 = Math.min(i + 1, last), i2 = Math.min(i + 2, last);
        for (let j = upper ? i : 0; j < d; j += 3) addTile(x, y, d, size, out, o, upper, i, i1, i2, j, Math.min(j + 1, last), Math.min(j + 2, last));
      }
    },
  };
}

/** One 3×3 tile: entries (r, c) for r ∈ {i, i1, i2}, c ∈ {j, j1, j2}, a repeated edge index written once, (with `upper`) c ≥ r only. */
function addTile(
  x: Float64Array, y: Float64Array, d: number, size: number, out: Float64Array, o: number, upper: boolean,
  i: number, i1: number, i2: number, j: number, j1: number, j2: number,
): void {
  let s00 = 0, s01 = 0, s02 = 0, s10 = 0, s11 = 0, s12 = 0, s20 = 0, s21 = 0, s22 = 0;
  for (let t = 0, row = 0; t < size; t++, row += d) {
    const p0 = x[row + i], p1 = x[row + i1], p2 = x[row + i2], q0 = y[row + j], q1 = y[row + j1], q2 = y[row + j2];
    s00 += p0 * q0; s01 += p0 * q1; s02 += p0 * q2;
    s10 += p1 * q0; s11 += p1 * q1; s12 += p1 * q2;
    s20 += p2 * q0; s21 += p2 * q1; s22 += p2 * q2;
  }
  const sums = [s00, s01, s02, s10, s11, s12, s20, s21, s22], rs = [i, i1, i2], cs = [j, j1, j2];
  for (let a = 0; a < 3; a++) {
    if (a > 0 && rs[a] === rs[a - 1]) break;
    for (let b = 0; b < 3; b++) {
      if (b > 0 && cs[b] === cs[b - 1]) break;
      if (!upper || cs[b] >= rs[a]) out[o + rs[a] * d + cs[b]] += sums[a * 3 + b];
    }
  }
}
