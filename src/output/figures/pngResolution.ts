import { CandelaError } from '../../errors.js';

/** The eight bytes every PNG file starts with (PNG specification, ISO/IEC 15948:2004, section 5.2). */
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
/** Metres per inch (exact, by definition of the inch). */
const METRES_PER_INCH = 0.0254;

let crcTable: Uint32Array | undefined;

/** CRC-32 of PNG chunks (ISO/IEC 15948:2004, annex D: polynomial 0xEDB88320, reflected). */
function crc32(bytes: Uint8Array): number {
  if (!crcTable) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  let crc = 0xffffffff;
  for (const byte of bytes) crc = crcTable[(crc ^ byte) & 0xff] ^ (crc >>> 8);
  return (crc ^ 0xffffffff) >>> 0;
}

/**
 * Records the print resolution in a PNG file: a `pHYs` chunk (ISO/IEC
 * 15948:2004, section 11.3.5.3; pixels per metre, unit specifier 1) placed
 * right after the IHDR chunk, replacing any `pHYs` already there. Word
 * processors and journal systems then size the image in inches as designed.
 *
 * Cost: O(file size) (one copy).
 *
 * @param png a PNG file
 * @param dotsPerInch resolution (pixels per inch, > 0), e.g. 300
 * @returns the PNG file with its resolution recorded
 * @throws CandelaError `figure.bad_png` when the bytes are not a PNG file; `figure.bad_png_resolution` for a resolution that is not positive
 * @example withPngResolution(svgToPng(svg, 1020), 300) // 1020 px print 3.4 in wide
 */
export function withPngResolution(png: Buffer, dotsPerInch: number): Buffer {
  if (!(dotsPerInch > 0 && Number.isFinite(dotsPerInch))) {
    throw new CandelaError({ code: 'figure.bad_png_resolution', message: 'the PNG resolution must be a positive number of pixels per inch', found: String(dotsPerInch) });
  }
  if (png.length < 33 || !png.subarray(0, 8).equals(PNG_SIGNATURE) || png.toString('latin1', 12, 16) !== 'IHDR') {
    throw new CandelaError({ code: 'figure.bad_png', message: 'the bytes are not a PNG file starting with its IHDR chunk' });
  }
  const pixelsPerMetre = Math.round(dotsPerInch / METRES_PER_INCH);
  const chunk = Buffer.alloc(21);
  chunk.writeUInt32BE(9, 0);
  chunk.write('pHYs', 4, 'latin1');
  chunk.writeUInt32BE(pixelsPerMetre, 8);
  chunk.writeUInt32BE(pixelsPerMetre, 12);
  chunk.writeUInt8(1, 16);
  chunk.writeUInt32BE(crc32(chunk.subarray(4, 17)), 17);
  const headerEnd = 8 + 12 + png.readUInt32BE(8);
  const parts: Buffer[] = [png.subarray(0, headerEnd), chunk];
  for (let offset = headerEnd; offset < png.length;) {
    const length = png.readUInt32BE(offset);
    const end = offset + 12 + length;
    if (png.toString('latin1', offset + 4, offset + 8) !== 'pHYs') parts.push(png.subarray(offset, end));
    offset = end;
  }
  return Buffer.concat(parts);
}
