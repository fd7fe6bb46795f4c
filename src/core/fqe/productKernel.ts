/**
 * A 2×8 tile of block cross products as a small WebAssembly function with 128-bit SIMD, written
 * out here in the binary format (WebAssembly Core Specification 2.0, §5 "Binary format"; the
 * fixed-width SIMD opcodes of §5.4.8):
 *   tile(x0, x1, y, stride, size, res):
 *     for t = 0 … size−1:  a_k += splat(x0[t]) · y[t][2k, 2k+1],  a_{4+k} += splat(x1[t]) · y[t][2k, 2k+1]  (k = 0…3)
 *     res[0 … 15] = a_0 … a_7
 * with every address in bytes in the imported memory, row t at +t·stride. Each lane of an
 * accumulator is one entry's sum, added one product at a time in row order from +0: f64x2.mul and
 * f64x2.add round each lane to nearest as the scalar f64.mul and f64.add do (IEEE 754; the
 * specification defines the lane operations as the scalar ones lane by lane), and no multiply is
 * fused with its add — so the sums are those of a plain dot product per entry, to the last bit.
 * Two rows against eight columns: ten 128-bit values live (eight accumulators, two splats) and a
 * load, within the sixteen vector registers of x86-64 and Arm64 (our choice of tile).
 *
 * simdTile() answers null where the host has no WebAssembly SIMD (the caller then keeps to its
 * scalar route); the compiled module is made once and kept (it holds no state).
 */

/** One tile function bound to a memory. */
export type SimdTile = (x0: number, x1: number, y: number, stride: number, size: number, res: number) => void;

const V128 = 0x7b, I32 = 0x7f;
const op = {
  loop: 0x03, end: 0x0b, brIf: 0x0d, localGet: 0x20, localSet: 0x21, localTee: 0x22, f64Load: 0x2b, i32Const: 0x41, i32Add: 0x6a, i32Sub: 0x6b,
} as const;
const simd = { load: [0xfd, 0x00], store: [0xfd, 0x0b], f64x2Splat: [0xfd, 0x14], f64x2Add: [0xfd, 0xf0, 0x01], f64x2Mul: [0xfd, 0xf2, 0x01] } as const;
// Parameters 0–5 as above; locals 6–13 the accumulators a_0…a_7, 14 and 15 the two splats, 16 the loaded pair of y.
const X0 = 0, X1 = 1, Y = 2, STRIDE = 3, SIZE = 4, RES = 5, ACC = 6, P0 = 14, P1 = 15, Q = 16;

function tileBody(): number[] {
  const code: number[] = [op.loop, 0x40];
  code.push(op.localGet, X0, op.f64Load, 3, 0, ...simd.f64x2Splat, op.localSet, P0);
  code.push(op.localGet, X1, op.f64Load, 3, 0, ...simd.f64x2Splat, op.localSet, P1);
  for (let k = 0; k < 4; k++) {
    code.push(op.localGet, Y, ...simd.load, 4, 16 * k, op.localSet, Q);
    code.push(op.localGet, ACC + k, op.localGet, P0, op.localGet, Q, ...simd.f64x2Mul, ...simd.f64x2Add, op.localSet, ACC + k);
    code.push(op.localGet, ACC + 4 + k, op.localGet, P1, op.localGet, Q, ...simd.f64x2Mul, ...simd.f64x2Add, op.localSet, ACC + 4 + k);
  }
  for (const p of [X0, X1, Y]) code.push(op.localGet, p, op.localGet, STRIDE, op.i32Add, op.localSet, p);
  code.push(op.localGet, SIZE, op.i32Const, 1, op.i32Sub, op.localTee, SIZE, op.brIf, 0, op.end);
  for (let k = 0; k < 8; k++) code.push(op.localGet, RES, op.localGet, ACC + k, ...simd.store, 4, 16 * k);
  code.push(op.end);
  const locals = [1, 11, V128]; // one run of eleven v128 locals
  return [...locals, ...code];
}

function section(id: number, content: number[]): number[] {
  return [id, ...leb(content.length), ...content];
}

function leb(value: number): number[] {
  const out: number[] = [];
  do {
    let byte = value & 0x7f;
    value >>>= 7;
    if (value !== 0) byte |= 0x80;
    out.push(byte);
  } while (value !== 0);
  return out;
}

const name = (s: string) => [s.length, ...Array.from(s, (c) => c.charCodeAt(0))];

/** The module's bytes: one function type, the memory imported as env.memory, one exported function `tile`. */
export function tileModuleBytes(): Uint8Array<ArrayBuffer> {
  const body = tileBody();
  return new Uint8Array([
    0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00,
    ...section(1, [1, 0x60, 6, I32, I32, I32, I32, I32, I32, 0]),
    ...section(2, [1, ...name('env'), ...name('memory'), 0x02, 0x00, 0x01]),
    ...section(3, [1, 0]),
    ...section(7, [1, ...name('tile'), 0x00, 0]),
    ...section(10, [1, ...leb(body.length), ...body]),
  ]);
}

let compiled: WebAssembly.Module | null | undefined;

/** The tile function on `memory`, or null where the host cannot compile it (no WebAssembly, or no SIMD). */
export function simdTile(memory: WebAssembly.Memory): SimdTile | null {
  if (compiled === undefined) {
    try {
      const bytes = tileModuleBytes();
      compiled = typeof WebAssembly === 'object' && WebAssembly.validate(bytes) ? new WebAssembly.Module(bytes) : null;
    } catch {
      compiled = null;
    }
  }
  if (compiled === null) return null;
  return new WebAssembly.Instance(compiled, { env: { memory } }).exports.tile as SimdTile;
}
