import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { CandelaError } from '../errors.js';

/** How many leading bytes are looked at to tell a text file from a binary one. */
const SNIFF_BYTES = 65536;

/** Leading bytes of compressed or archive formats (their specifications' magic numbers), with the command that unpacks them. */
const PACKED_FORMATS: Array<{ name: string; magic: number[]; unpack: string }> = [
  { name: 'gzip-compressed', magic: [0x1f, 0x8b], unpack: 'gunzip' }, // RFC 1952, section 2.3.1
  { name: 'bzip2-compressed', magic: [0x42, 0x5a, 0x68], unpack: 'bunzip2' }, // 'BZh'
  { name: 'xz-compressed', magic: [0xfd, 0x37, 0x7a, 0x58, 0x5a, 0x00], unpack: 'unxz' },
  { name: 'a zip archive', magic: [0x50, 0x4b, 0x03, 0x04], unpack: 'unzip' }, // 'PK\3\4'
];

/**
 * What a binary file is, or null for text: a known compressed format by its
 * leading bytes, or "binary" when a NUL byte appears in the first
 * {@link SNIFF_BYTES} bytes (no text table or matrix holds one).
 */
function binaryKind(bytes: Buffer): { name: string; unpack: string | null } | null {
  for (const format of PACKED_FORMATS) {
    if (format.magic.every((byte, k) => bytes[k] === byte)) return { name: format.name, unpack: format.unpack };
  }
  return bytes.subarray(0, SNIFF_BYTES).includes(0) ? { name: 'binary (it holds NUL bytes)', unpack: null } : null;
}

/**
 * Reads a text file and returns its lines (index 0 is line 1), without line
 * breaks (LF or CRLF) and without a leading byte-order mark. Compressed and
 * other binary files are refused before any of their bytes reach a message.
 * Paths named in a configuration reach this function already resolved
 * against the configuration file's folder; messages show that resolved path.
 * Cost: one read of the file.
 * @param file path to read.
 * @param displayName how to name the file in messages.
 * @throws CandelaError `data.file_not_found`, `data.not_a_file` (a folder),
 *   `data.not_text` (compressed or binary) or `data.file_unreadable`.
 * @example readTextLines('../shared/data-real/pantheon2018/Binned_data/sys_DS17f.txt', 'sys')[0] // '40'
 */
export function readTextLines(file: string, displayName: string): string[] {
  let bytes: Buffer;
  const absolute = resolve(file);
  try {
    bytes = readFileSync(file);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') {
      throw new CandelaError({
        code: 'data.file_not_found', message: 'the file does not exist', file: displayName, found: `nothing at ${absolute}`,
        fix: 'check the path; a relative path in a configuration is read from the folder of the configuration file, not from the folder candela runs in',
      });
    }
    if (code === 'EISDIR') {
      throw new CandelaError({
        code: 'data.not_a_file', message: 'the path is a folder, not a file', file: displayName, found: `a folder at ${absolute}`,
        fix: 'name the file inside that folder',
      });
    }
    throw new CandelaError({
      code: 'data.file_unreadable', message: `the file cannot be read (${code ?? String(error)})`, file: displayName, found: absolute,
      fix: 'check that the path names a readable file',
    });
  }
  const binary = binaryKind(bytes);
  if (binary) {
    throw new CandelaError({
      code: 'data.not_text', message: `the file is ${binary.name}, not a text table or matrix`, file: displayName, found: absolute,
      fix: binary.unpack ? `unpack it first (e.g. ${binary.unpack} ${displayName}) and name the unpacked text file` : 'name the text file that holds the numbers',
    });
  }
  let text = bytes.toString('utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const lines = text.split(/\r?\n/);
  if (lines.length > 0 && lines[lines.length - 1] === '') lines.pop();
  return lines;
}
