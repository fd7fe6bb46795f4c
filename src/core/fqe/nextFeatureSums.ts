/**
 * The part of a block's Bellman sums (bellmanStatistics.ts) that depends on the evaluated policy:
 * M = ΦᵀΨ, H = ΨᵀΨ and Ψᵀr, with ψ_i the policy's expected next features. The rest — G = ΦᵀΦ, Φᵀr
 * and rᵀr — reads only the logged (s, a, r), so every policy evaluated with the same feature map on
 * the same data has the same G to the last bit (same rows, same blocks, same order of addition).
 * A pass for a second policy (another candidate, or the present controller) therefore takes those
 * from the first policy's pass and forms only these: about a quarter fewer multiply-adds per row
 * (2d² → 1.5d²), and fewer live accumulators in the inner loop.
 *
 * Shapes as in bellmanStatistics.ts: block features row-major (B×d), packed sums
 * [ΦᵀΦ | ΦᵀΨ | ΨᵀΨ | Φᵀr | Ψᵀr | rᵀr | n]; only the ΦᵀΨ, ΨᵀΨ and Ψᵀr parts are touched here.
 */
import type { BlockProducts } from './blockProducts';

/** Rows gathered for one block of a pass (bellmanStatistics.ts). */
export interface Block {
  readonly d: number;
  readonly rows: number; // B
  readonly phi: Float64Array; // B×d row-major: phi[t·d + a] = φ_a of row t (products.phi)
  readonly psi: Float64Array; // B×d row-major (products.psi)
  readonly reward: Float64Array; // B
  /** Where phi and psi live, and their cross products (blockProducts.ts). */
  readonly products: BlockProducts;
}

/** Add the policy-dependent sums of the block's first `size` rows at out[base …], each entry in the same order as the full block sum (blockProducts.ts). */
export function addNextBlock(block: Block, size: number, out: Float64Array, base: number): void {
  const { d, phi, psi, reward, products } = block, dd = d * d;
  products.add(phi, psi, size, out, base + dd, false);
  products.add(psi, psi, size, out, base + 2 * dd, true);
  for (let a = 0; a < d; a++) {
    let er = 0;
    for (let t = 0; t < size; t++) er += psi[t * d + a] * reward[t];
    out[base + 3 * dd + d + a] += er;
  }
}
