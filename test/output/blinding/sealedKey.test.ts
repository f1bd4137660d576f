import { describe, expect, it } from 'vitest';
import { blindingRunIdentity, sealBlindingKey, unsealBlindingKey, type BlindingKey } from '../../../src/output/index.js';

const identity = blindingRunIdentity('31415', 'flat_w0wa', ['w0', 'wa', 'omega_m']);
const key: BlindingKey = { identity, offsets: { w0: -0.2137, wa: 0.8123, omega_m: 0.0437 }, widths: { w0: 0.3, wa: 1, omega_m: 0.1 }, salt: '00ff17' };

describe('sealBlindingKey / unsealBlindingKey', () => {
  it('reads back exactly what was sealed', () => {
    expect(unsealBlindingKey(sealBlindingKey(key), 'k', identity)).toEqual(key);
  });

  it('writes no offset where it can be read by accident: no decimal number in the file', () => {
    const text = sealBlindingKey(key);
    expect(text.startsWith('# candela sealed blinding key')).toBe(true);
    for (const value of Object.values(key.offsets)) expect(text).not.toContain(String(value));
    // base64 has neither "." nor "-": no signed decimal can appear outside the header.
    const body = text.split('\n').filter((line) => !line.startsWith('#')).join('\n');
    expect(body).not.toMatch(/\d\.\d/);
  });

  it('refuses a damaged payload, naming the file', () => {
    const text = sealBlindingKey(key).replace(/payload: (.)/, (_, c: string) => `payload: ${c === 'A' ? 'B' : 'A'}`);
    expect(() => unsealBlindingKey(text, 'out/run/blinding.key')).toThrow(/out\/run\/blinding.key.*damaged/);
    expect(() => unsealBlindingKey('nothing here', 'k')).toThrow(/missing sealed-for/);
  });

  it('refuses the key of another run', () => {
    const other = blindingRunIdentity('31416', 'flat_w0wa', ['w0', 'wa', 'omega_m']);
    expect(other).not.toBe(identity);
    expect(() => unsealBlindingKey(sealBlindingKey(key), 'k', other)).toThrow(/another run/);
  });
});
