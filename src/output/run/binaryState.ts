/**
 * A compact, exact file format for checkpoint state: a JSON header in which
 * every Float64Array / Int32Array / Uint32Array is replaced by a reference to
 * a little-endian binary segment that follows the header. Doubles round-trip
 * bit for bit, which a resumed run needs to reproduce an uninterrupted one.
 *
 * Layout: 8-byte magic 'CNDLSTA1', uint32 header byte length, header (UTF-8
 * JSON), zero padding to a multiple of 8, then the segments, each 8-aligned.
 */
const MAGIC = 'CNDLSTA1';

type TypedKind = 'f64' | 'i32' | 'u32';
interface SegmentRef { $typed: TypedKind; offset: number; length: number }

function kindOf(value: unknown): TypedKind | null {
  if (value instanceof Float64Array) return 'f64';
  if (value instanceof Int32Array) return 'i32';
  if (value instanceof Uint32Array) return 'u32';
  return null;
}

/** Encodes a state object (plain JSON values and typed arrays) into one buffer. */
export function encodeBinaryState(state: unknown): Buffer {
  const segments: ArrayBufferView[] = [];
  let offset = 0;
  const header = JSON.stringify(state, function replacer(this: unknown, _key, value: unknown) {
    const kind = kindOf(value);
    if (!kind) return value;
    const view = value as Float64Array | Int32Array | Uint32Array;
    const ref: SegmentRef = { $typed: kind, offset, length: view.length };
    segments.push(view);
    offset += Math.ceil(view.byteLength / 8) * 8;
    return ref;
  });
  const headerBytes = Buffer.from(header, 'utf8');
  const headerPadded = Math.ceil((12 + headerBytes.length) / 8) * 8;
  const output = Buffer.alloc(headerPadded + offset);
  output.write(MAGIC, 0, 'latin1');
  output.writeUInt32LE(headerBytes.length, 8);
  headerBytes.copy(output, 12);
  let position = headerPadded;
  for (const view of segments) {
    Buffer.from(view.buffer, view.byteOffset, view.byteLength).copy(output, position);
    position += Math.ceil(view.byteLength / 8) * 8;
  }
  return output;
}

/** Decodes a buffer written by {@link encodeBinaryState}; throws on a damaged file. */
export function decodeBinaryState<T>(buffer: Buffer): T {
  if (buffer.length < 12 || buffer.toString('latin1', 0, 8) !== MAGIC) throw new Error('not a candela state file (bad magic)');
  const headerLength = buffer.readUInt32LE(8);
  if (12 + headerLength > buffer.length) throw new Error('truncated candela state file');
  const header = buffer.toString('utf8', 12, 12 + headerLength);
  const base = Math.ceil((12 + headerLength) / 8) * 8;
  return JSON.parse(header, (_key, value: unknown) => {
    if (value && typeof value === 'object' && '$typed' in value) {
      const ref = value as SegmentRef;
      const bytesPer = ref.$typed === 'f64' ? 8 : 4;
      const start = base + ref.offset;
      const end = start + ref.length * bytesPer;
      if (end > buffer.length) throw new Error('truncated candela state file');
      const copy = new ArrayBuffer(ref.length * bytesPer);
      new Uint8Array(copy).set(buffer.subarray(start, end));
      return ref.$typed === 'f64' ? new Float64Array(copy) : ref.$typed === 'i32' ? new Int32Array(copy) : new Uint32Array(copy);
    }
    return value;
  }) as T;
}
