import { describe, expect, it } from 'vitest';
import { decodeBinaryState, encodeBinaryState } from '../../../src/output/run/binaryState.js';

describe('encodeBinaryState / decodeBinaryState', () => {
  it('round-trips doubles bit for bit, including subnormals, -0 and infinities', () => {
    const values = Float64Array.of(Math.PI, -0, 5e-324, Number.MAX_VALUE, -Infinity, 1 / 3);
    const state = { step: 12, rng: { c: 1, s0: 0.25 }, chains: [values, new Int32Array([1, -2, 3])], tail: new Uint32Array([7]) };
    const decoded = decodeBinaryState<typeof state>(encodeBinaryState(state));
    expect(decoded.step).toBe(12);
    expect(decoded.rng).toEqual({ c: 1, s0: 0.25 });
    expect(Buffer.from(decoded.chains[0].buffer).equals(Buffer.from(values.buffer))).toBe(true);
    expect(Object.is(decoded.chains[0][1], -0)).toBe(true);
    expect(Array.from(decoded.chains[1])).toEqual([1, -2, 3]);
    expect(decoded.tail).toBeInstanceOf(Uint32Array);
  });
  it('refuses a truncated or foreign file', () => {
    const bytes = encodeBinaryState({ a: new Float64Array(100) });
    expect(() => decodeBinaryState(bytes.subarray(0, bytes.length - 8))).toThrow(/truncated/);
    expect(() => decodeBinaryState(Buffer.from('hello world, not a state'))).toThrow(/magic/);
  });
});
