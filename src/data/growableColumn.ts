/**
 * A column of numbers that grows while a file streams in: a Float64Array whose capacity doubles
 * when full, so a million-row column costs one 8 MB buffer (plus a transient copy while growing)
 * instead of a million boxed JS numbers.
 */
export class GrowableColumn {
  private buffer: Float64Array;
  private used = 0;

  constructor(initialCapacity = 1024) {
    this.buffer = new Float64Array(Math.max(16, initialCapacity));
  }

  get length(): number {
    return this.used;
  }

  push(value: number): void {
    if (this.used === this.buffer.length) {
      const larger = new Float64Array(this.buffer.length * 2);
      larger.set(this.buffer);
      this.buffer = larger;
    }
    this.buffer[this.used++] = value;
  }

  /** The first `length` values pushed (all by default), as an exactly sized copy. */
  toArray(length = this.used): Float64Array {
    return this.buffer.slice(0, Math.min(length, this.used));
  }
}
