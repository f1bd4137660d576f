/**
 * The sealed key of a blinded run (blinding.key in its folder): the secret
 * offsets, encoded so that nobody reads them by accident, tied to the run it
 * belongs to and checked for damage. A guard against accidental viewing,
 * not encryption: anyone who decodes the payload on purpose sees the offsets.
 */
import { createHash } from 'node:crypto';
import { CandelaError } from '../../errors.js';

/** What the key holds. */
export interface BlindingKey {
  /** Checksum of the run the key belongs to (blindingRunIdentity). */
  identity: string;
  /** Secret offset per blinded parameter, in the parameter's unit (shown = true + offset). */
  offsets: Record<string, number>;
  /** Width per blinded parameter the offsets were drawn with. */
  widths: Record<string, number>;
  /** The random salt mixed into the offsets' seed (hex). */
  salt: string;
}

/** Version of the key layout. */
const KEY_FORMAT = 1;
const HEADER = [
  '# candela sealed blinding key: DO NOT DECODE BY HAND (that would unblind you).',
  '# It holds the secret offsets added to the blinded parameters of this run, encoded so that',
  '# they are not read by accident; this is not encryption. To see the true values run',
  '#   candela unblind <this run folder>',
  '# Without this file the run cannot be unblinded (the true chains stay in chain-record.bin).',
];

const sha256 = (text: string): string => createHash('sha256').update(text).digest('hex');

/**
 * A checksum naming one run: its seed, model label and blinded parameters.
 * A key copied into another run's folder is refused by unsealBlindingKey.
 * @param seed the run seed as text.
 * @param modelLabel the model's label.
 * @param parameters blinded parameter names, in order.
 * @returns SHA-256 hex (64 characters).
 * @throws nothing.
 * @example blindingRunIdentity('7', 'flat_w0wa', ['w0']).length // 64
 */
export function blindingRunIdentity(seed: string, modelLabel: string, parameters: readonly string[]): string {
  return sha256(JSON.stringify(['candela-blinding', seed, modelLabel, [...parameters]]));
}

/**
 * The text of a key file: a warning header, the run identity, the payload
 * (base64 of JSON: no decimal point or minus sign can appear in it, so no
 * value is legible) and a SHA-256 checksum of identity and payload.
 * @param key what to seal.
 * @returns the file text, ending with a newline.
 * @throws nothing.
 * @example sealBlindingKey(key).startsWith('# candela sealed blinding key') // true
 */
export function sealBlindingKey(key: BlindingKey): string {
  const payload = Buffer.from(JSON.stringify({ format: KEY_FORMAT, offsets: key.offsets, widths: key.widths, salt: key.salt }), 'utf8').toString('base64');
  return `${[...HEADER, `sealed-for: ${key.identity}`, `payload: ${payload}`, `checksum: ${sha256(`${key.identity}\n${payload}`)}`].join('\n')}\n`;
}

/**
 * Reads a key file's text back.
 * @param text the file's text.
 * @param file the key file's path, for messages.
 * @param expectedIdentity when given, the run the key must belong to (blindingRunIdentity).
 * @returns the key.
 * @throws CandelaError `blinding.damaged_key` when a line is missing, the checksum does not match or the payload does not decode;
 *   `blinding.foreign_key` when the key belongs to another run.
 * @example unsealBlindingKey(sealBlindingKey(key), 'out/run/blinding.key').offsets.w0 === key.offsets.w0 // true
 */
export function unsealBlindingKey(text: string, file: string, expectedIdentity?: string): BlindingKey {
  const field = (name: string): string | undefined => text.split(/\r?\n/).find((line) => line.startsWith(`${name}: `))?.slice(name.length + 2).trim();
  const identity = field('sealed-for');
  const payload = field('payload');
  const checksum = field('checksum');
  const damaged = (found: string): CandelaError => new CandelaError({
    code: 'blinding.damaged_key', file, message: 'the sealed blinding key is damaged', expected: 'the key file as candela fit wrote it', found,
    fix: 'restore blinding.key from a backup of the run folder; without it the run cannot be unblinded (refit without blinding to see the true values)',
  });
  if (!identity || !payload || !checksum) throw damaged('a missing sealed-for, payload or checksum line');
  if (sha256(`${identity}\n${payload}`) !== checksum) throw damaged('a checksum that does not match its payload');
  let decoded: { format?: unknown; offsets?: unknown; widths?: unknown; salt?: unknown };
  try {
    decoded = JSON.parse(Buffer.from(payload, 'base64').toString('utf8')) as typeof decoded;
  } catch {
    throw damaged('a payload that does not decode');
  }
  const isNumbers = (value: unknown): value is Record<string, number> =>
    typeof value === 'object' && value !== null && Object.values(value).every((v) => typeof v === 'number' && Number.isFinite(v));
  if (decoded.format !== KEY_FORMAT || !isNumbers(decoded.offsets) || !isNumbers(decoded.widths) || typeof decoded.salt !== 'string') {
    throw damaged(`a payload of another layout (format ${String(decoded.format)})`);
  }
  if (expectedIdentity !== undefined && identity !== expectedIdentity) {
    throw new CandelaError({
      code: 'blinding.foreign_key', file, message: 'this blinding key belongs to another run (another seed, model or list of blinded parameters)',
      expected: `the key of this run (${expectedIdentity.slice(0, 12)}...)`, found: `a key sealed for ${identity.slice(0, 12)}...`,
      fix: 'put back the blinding.key that candela fit wrote into this run folder',
    });
  }
  return { identity, offsets: decoded.offsets, widths: decoded.widths, salt: decoded.salt };
}
