/**
 * JSON on the wire between browserApi.js and the test server: a Uint8Array travels as
 * `{ "$bytes": "<base64>" }` (RFC 4648 §4), everything else as plain JSON. browserApi.js has the
 * browser half of the same rule.
 */
export function toWire(value: unknown): unknown {
  if (value instanceof Uint8Array) return { $bytes: Buffer.from(value.buffer, value.byteOffset, value.byteLength).toString('base64') };
  if (Array.isArray(value)) return value.map(toWire);
  if (value !== null && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, toWire(v)]));
  return value;
}

export function fromWire(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(fromWire);
  if (value !== null && typeof value === 'object') {
    const record = value as Record<string, unknown>;
    if (Object.keys(record).length === 1 && typeof record.$bytes === 'string') return new Uint8Array(Buffer.from(record.$bytes, 'base64'));
    return Object.fromEntries(Object.entries(record).map(([k, v]) => [k, fromWire(v)]));
  }
  return value;
}
