/**
 * Rows of a row-major matrix picked by a mask: the held-actions repair fits the present controller's law on the
 * rows not held (behaviourModel.ts), and the held-actions check fits it on every row and on those (heldActions.ts).
 */

/** The indices i with mask[i] set. */
export function selectedRows(mask: Uint8Array): number[] {
  const rows: number[] = [];
  for (let i = 0; i < mask.length; i++) if (mask[i]) rows.push(i);
  return rows;
}

/** The given rows of an n×d row-major matrix, in order: rows.length×d. */
export function selectRows(x: ArrayLike<number>, d: number, rows: readonly number[]): Float64Array {
  const out = new Float64Array(rows.length * d);
  rows.forEach((i, k) => {
    for (let p = 0; p < d; p++) out[k * d + p] = x[i * d + p];
  });
  return out;
}
