import { CandelaError } from '../../../errors.js';

/** One drawing step in absolute coordinates (SVG user units): move, straight line, cubic Bezier or close. */
export type PathSegment =
  | { kind: 'move'; x: number; y: number }
  | { kind: 'line'; x: number; y: number }
  | { kind: 'cubic'; x1: number; y1: number; x2: number; y2: number; x: number; y: number }
  | { kind: 'close' };

/** Number of coordinates each SVG path command takes (SVG 1.1, section 8.3). */
const ARGUMENT_COUNT: Readonly<Record<string, number>> = { m: 2, l: 2, h: 1, v: 1, c: 6, s: 4, q: 4, t: 2, a: 7, z: 0 };

/**
 * The cubic Bezier segments of an elliptical arc, after the endpoint-to-centre
 * conversion of the SVG 1.1 specification (W3C 2011, appendix F.6.5, with the
 * radius correction of F.6.6), one cubic per quarter turn or less, with the
 * control-point distance 4/3 tan(delta/4) of each piece (common practice).
 */
function arcToCubics(x0: number, y0: number, rxIn: number, ryIn: number, rotationDeg: number, largeArc: boolean, sweep: boolean, x: number, y: number): PathSegment[] {
  let rx = Math.abs(rxIn);
  let ry = Math.abs(ryIn);
  if (rx === 0 || ry === 0 || (x0 === x && y0 === y)) return [{ kind: 'line', x, y }];
  const phi = (rotationDeg * Math.PI) / 180;
  const cosPhi = Math.cos(phi);
  const sinPhi = Math.sin(phi);
  const halfDx = (x0 - x) / 2;
  const halfDy = (y0 - y) / 2;
  const x1p = cosPhi * halfDx + sinPhi * halfDy;
  const y1p = -sinPhi * halfDx + cosPhi * halfDy;
  const lambda = (x1p * x1p) / (rx * rx) + (y1p * y1p) / (ry * ry);
  if (lambda > 1) {
    rx *= Math.sqrt(lambda);
    ry *= Math.sqrt(lambda);
  }
  const numerator = rx * rx * ry * ry - rx * rx * y1p * y1p - ry * ry * x1p * x1p;
  const denominator = rx * rx * y1p * y1p + ry * ry * x1p * x1p;
  const root = Math.sqrt(Math.max(0, numerator / denominator)) * (largeArc === sweep ? -1 : 1);
  const cxp = (root * rx * y1p) / ry;
  const cyp = (-root * ry * x1p) / rx;
  const cx = cosPhi * cxp - sinPhi * cyp + (x0 + x) / 2;
  const cy = sinPhi * cxp + cosPhi * cyp + (y0 + y) / 2;
  const angle = (ux: number, uy: number, vx: number, vy: number) => Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy);
  const theta1 = angle(1, 0, (x1p - cxp) / rx, (y1p - cyp) / ry);
  let delta = angle((x1p - cxp) / rx, (y1p - cyp) / ry, (-x1p - cxp) / rx, (-y1p - cyp) / ry);
  if (!sweep && delta > 0) delta -= 2 * Math.PI;
  if (sweep && delta < 0) delta += 2 * Math.PI;
  const pieces = Math.max(1, Math.ceil(Math.abs(delta) / (Math.PI / 2) - 1e-9));
  const step = delta / pieces;
  const handle = (4 / 3) * Math.tan(step / 4);
  const point = (theta: number) => [cx + rx * Math.cos(theta) * cosPhi - ry * Math.sin(theta) * sinPhi, cy + rx * Math.cos(theta) * sinPhi + ry * Math.sin(theta) * cosPhi];
  const tangent = (theta: number) => [-rx * Math.sin(theta) * cosPhi - ry * Math.cos(theta) * sinPhi, -rx * Math.sin(theta) * sinPhi + ry * Math.cos(theta) * cosPhi];
  const segments: PathSegment[] = [];
  for (let piece = 0; piece < pieces; piece++) {
    const start = theta1 + piece * step;
    const end = start + step;
    const [sx, sy] = point(start);
    const [ex, ey] = piece === pieces - 1 ? [x, y] : point(end);
    const [tsx, tsy] = tangent(start);
    const [tex, tey] = tangent(end);
    segments.push({ kind: 'cubic', x1: sx + handle * tsx, y1: sy + handle * tsy, x2: ex - handle * tex, y2: ey - handle * tey, x: ex, y: ey });
  }
  return segments;
}

/**
 * Reads SVG path data (SVG 1.1, section 8.3: M, L, H, V, C, S, Q, T, A, Z in
 * absolute and relative form, implicit repeats) into absolute moves, lines,
 * cubic Beziers and closes: quadratic curves are raised to cubics and arcs
 * split into cubics, so a PDF content stream can draw them with m, l, c, h.
 *
 * Cost: O(length of the path data).
 *
 * @param data the `d` attribute
 * @returns the segments in drawing order
 * @throws CandelaError `figure.bad_svg` for path data that cannot be read
 * @example svgPathSegments('M1 2h3') // [{ kind: 'move', x: 1, y: 2 }, { kind: 'line', x: 4, y: 2 }]
 */
export function svgPathSegments(data: string): PathSegment[] {
  const tokens = data.match(/[a-df-z]|[-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?/gi) ?? [];
  const segments: PathSegment[] = [];
  let index = 0;
  let command = '';
  let x = 0;
  let y = 0;
  let startX = 0;
  let startY = 0;
  let lastControlX = 0;
  let lastControlY = 0;
  let lastKind = '';
  const number = () => {
    const token = tokens[index++];
    const value = token === undefined ? Number.NaN : Number(token);
    if (!Number.isFinite(value)) throw new CandelaError({ code: 'figure.bad_svg', message: `the SVG path data could not be read near "${tokens.slice(Math.max(0, index - 3), index + 2).join(' ')}"` });
    return value;
  };
  while (index < tokens.length) {
    if (/^[a-z]$/i.test(tokens[index])) command = tokens[index++];
    else if (command === '') number();
    const lower = command.toLowerCase();
    const relative = command !== command.toUpperCase();
    const baseX = relative ? x : 0;
    const baseY = relative ? y : 0;
    if (lower === 'z') {
      segments.push({ kind: 'close' });
      x = startX;
      y = startY;
      lastKind = 'z';
      continue;
    }
    if (ARGUMENT_COUNT[lower] === undefined) throw new CandelaError({ code: 'figure.bad_svg', message: `unknown SVG path command "${command}"` });
    if (lower === 'm') {
      x = baseX + number();
      y = baseY + number();
      startX = x;
      startY = y;
      segments.push({ kind: 'move', x, y });
      command = relative ? 'l' : 'L';
    } else if (lower === 'l' || lower === 'h' || lower === 'v') {
      if (lower !== 'v') x = baseX + number();
      if (lower !== 'h') y = baseY + number();
      segments.push({ kind: 'line', x, y });
    } else if (lower === 'c' || lower === 's') {
      const reflect = lastKind === 'c' || lastKind === 's';
      const x1 = lower === 'c' ? baseX + number() : reflect ? 2 * x - lastControlX : x;
      const y1 = lower === 'c' ? baseY + number() : reflect ? 2 * y - lastControlY : y;
      const x2 = baseX + number();
      const y2 = baseY + number();
      const endX = baseX + number();
      const endY = baseY + number();
      segments.push({ kind: 'cubic', x1, y1, x2, y2, x: endX, y: endY });
      [lastControlX, lastControlY, x, y] = [x2, y2, endX, endY];
    } else if (lower === 'q' || lower === 't') {
      const reflect = lastKind === 'q' || lastKind === 't';
      const qx = lower === 'q' ? baseX + number() : reflect ? 2 * x - lastControlX : x;
      const qy = lower === 'q' ? baseY + number() : reflect ? 2 * y - lastControlY : y;
      const endX = baseX + number();
      const endY = baseY + number();
      segments.push({ kind: 'cubic', x1: x + (2 / 3) * (qx - x), y1: y + (2 / 3) * (qy - y), x2: endX + (2 / 3) * (qx - endX), y2: endY + (2 / 3) * (qy - endY), x: endX, y: endY });
      [lastControlX, lastControlY, x, y] = [qx, qy, endX, endY];
    } else {
      const [rx, ry, rotation, large, sweep] = [number(), number(), number(), number(), number()];
      const endX = baseX + number();
      const endY = baseY + number();
      segments.push(...arcToCubics(x, y, rx, ry, rotation, large !== 0, sweep !== 0, endX, endY));
      x = endX;
      y = endY;
    }
    lastKind = lower;
  }
  return segments;
}
