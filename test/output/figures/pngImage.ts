// Test helper: reads a PNG file as the W3C PNG specification (2nd ed., 2003) lays it out:
// the 8-byte signature, then chunks (length, type, data, CRC). `pngSize` reads only the IHDR
// chunk; `decodePng` also inflates the IDAT data and undoes the five scanline filters
// (section 9.2) for 8-bit, non-interlaced RGB or RGBA images, which is what resvg writes.
import { inflateSync } from 'node:zlib';

const SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

export interface PngHeader {
  width: number;
  height: number;
  bitDepth: number;
  colorType: number;
  interlace: number;
}

export function pngSize(bytes: Uint8Array): PngHeader {
  SIGNATURE.forEach((value, index) => {
    if (bytes[index] !== value) throw new Error('not a PNG signature');
  });
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const type = String.fromCharCode(...bytes.subarray(12, 16));
  if (type !== 'IHDR' || view.getUint32(8) !== 13) throw new Error('first chunk is not a 13-byte IHDR');
  return { width: view.getUint32(16), height: view.getUint32(20), bitDepth: bytes[24], colorType: bytes[25], interlace: bytes[28] };
}

export interface DecodedPng {
  width: number;
  height: number;
  /** Bytes per pixel: 3 (RGB) or 4 (RGBA). */
  channels: number;
  pixels: Uint8Array;
}

export function decodePng(bytes: Uint8Array): DecodedPng {
  const header = pngSize(bytes);
  if (header.bitDepth !== 8 || header.interlace !== 0 || (header.colorType !== 2 && header.colorType !== 6)) {
    throw new Error(`unsupported PNG layout ${JSON.stringify(header)}`);
  }
  const channels = header.colorType === 6 ? 4 : 3;
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const parts: Uint8Array[] = [];
  for (let offset = 8; offset < bytes.length; ) {
    const length = view.getUint32(offset);
    const type = String.fromCharCode(...bytes.subarray(offset + 4, offset + 8));
    if (type === 'IDAT') parts.push(bytes.subarray(offset + 8, offset + 8 + length));
    offset += 12 + length;
    if (type === 'IEND') break;
  }
  const raw = inflateSync(Buffer.concat(parts));
  const stride = header.width * channels;
  const pixels = new Uint8Array(header.height * stride);
  for (let row = 0; row < header.height; row++) {
    const filter = raw[row * (stride + 1)];
    const line = raw.subarray(row * (stride + 1) + 1, (row + 1) * (stride + 1));
    for (let index = 0; index < stride; index++) {
      const left = index >= channels ? pixels[row * stride + index - channels] : 0;
      const up = row > 0 ? pixels[(row - 1) * stride + index] : 0;
      const upLeft = row > 0 && index >= channels ? pixels[(row - 1) * stride + index - channels] : 0;
      let predictor = 0;
      if (filter === 1) predictor = left;
      else if (filter === 2) predictor = up;
      else if (filter === 3) predictor = (left + up) >> 1;
      else if (filter === 4) {
        const estimate = left + up - upLeft;
        const distances = [Math.abs(estimate - left), Math.abs(estimate - up), Math.abs(estimate - upLeft)];
        predictor = distances[0] <= distances[1] && distances[0] <= distances[2] ? left : distances[1] <= distances[2] ? up : upLeft;
      } else if (filter !== 0) throw new Error(`unknown PNG filter ${filter}`);
      pixels[row * stride + index] = (line[index] + predictor) & 0xff;
    }
  }
  return { width: header.width, height: header.height, channels, pixels };
}

/** Number of pixels whose red, green and blue are all below `level` (0-255) inside a rectangle. */
export function countDarkPixels(image: DecodedPng, level: number, box = { x: 0, y: 0, width: image.width, height: image.height }): number {
  let count = 0;
  for (let y = box.y; y < box.y + box.height; y++) {
    for (let x = box.x; x < box.x + box.width; x++) {
      const offset = (y * image.width + x) * image.channels;
      if (image.pixels[offset] < level && image.pixels[offset + 1] < level && image.pixels[offset + 2] < level) count++;
    }
  }
  return count;
}
