import { CandelaError } from '../../../errors.js';
import { pdfFileBytes } from './pdfFileBytes.js';
import { pdfTextRuns } from './pdfTextRuns.js';
import type { PdfTextFace } from './pdfTextRuns.js';
import { parseSvgTree } from './svgTree.js';
import type { SvgNode } from './svgTree.js';
import { svgPathSegments } from './svgPathSegments.js';
import type { PathSegment } from './svgPathSegments.js';

/** PostScript points per CSS pixel: 72 pt and 96 px are both one inch (CSS Values 3, section 6.2). */
const POINTS_PER_PX = 0.75;
/** Bezier handle length of a quarter circle, 4/3 (sqrt 2 - 1) of the radius (common practice). */
const CIRCLE_HANDLE = 0.5522847498;

/** Paint and text settings that SVG children inherit from their parents. */
interface InheritedStyle {
  fill: string;
  stroke: string;
  strokeWidth: number;
  fillOpacity: number;
  strokeOpacity: number;
  dash: string;
  lineJoin: string;
  lineCap: string;
  fillRule: string;
  fontSizePx: number;
  anchor: string;
}

const INITIAL_STYLE: InheritedStyle = {
  fill: '#000000', stroke: 'none', strokeWidth: 1, fillOpacity: 1, strokeOpacity: 1, dash: 'none',
  lineJoin: 'miter', lineCap: 'butt', fillRule: 'nonzero', fontSizePx: 16, anchor: 'start',
};

const NAMED_COLORS: Readonly<Record<string, string>> = { black: '#000000', white: '#ffffff', red: '#ff0000', gray: '#808080', grey: '#808080' };
const LINE_JOIN: Readonly<Record<string, number>> = { miter: 0, round: 1, bevel: 2 };
const LINE_CAP: Readonly<Record<string, number>> = { butt: 0, round: 1, square: 2 };

function num(value: number): string {
  const rounded = Number(value.toFixed(3));
  return Object.is(rounded, -0) ? '0' : String(rounded);
}

function rgb(color: string): [number, number, number] | undefined {
  const named = NAMED_COLORS[color.trim().toLowerCase()] ?? color.trim();
  const long = /^#([0-9a-f]{6})$/i.exec(named);
  const short = /^#([0-9a-f]{3})$/i.exec(named);
  const hex = long ? long[1] : short ? short[1].replace(/./g, (digit) => digit + digit) : undefined;
  if (!hex) return undefined;
  const value = Number.parseInt(hex, 16);
  return [(value >> 16) & 255, (value >> 8) & 255, value & 255].map((channel) => channel / 255) as [number, number, number];
}

function numberAttribute(node: SvgNode, name: string, fallback = 0): number {
  const value = Number.parseFloat(node.attributes[name] ?? '');
  return Number.isFinite(value) ? value : fallback;
}

/** The SVG `transform` list (SVG 1.1, section 7.6) as one PDF matrix [a b c d e f]. */
function transformMatrix(text: string): number[] {
  let matrix = [1, 0, 0, 1, 0, 0];
  const multiply = (next: number[]) => {
    const [a, b, c, d, e, f] = matrix;
    matrix = [a * next[0] + c * next[1], b * next[0] + d * next[1], a * next[2] + c * next[3], b * next[2] + d * next[3], a * next[4] + c * next[5] + e, b * next[4] + d * next[5] + f];
  };
  for (const [, kind, argumentText] of text.matchAll(/(matrix|translate|scale|rotate)\s*\(([^)]*)\)/g)) {
    const values = argumentText.split(/[\s,]+/).filter((part) => part !== '').map(Number);
    if (kind === 'matrix' && values.length === 6) multiply(values);
    else if (kind === 'translate') multiply([1, 0, 0, 1, values[0] ?? 0, values[1] ?? 0]);
    else if (kind === 'scale') multiply([values[0] ?? 1, 0, 0, values[1] ?? values[0] ?? 1, 0, 0]);
    else if (kind === 'rotate') {
      const angle = ((values[0] ?? 0) * Math.PI) / 180;
      const [cx, cy] = [values[1] ?? 0, values[2] ?? 0];
      multiply([1, 0, 0, 1, cx, cy]);
      multiply([Math.cos(angle), Math.sin(angle), -Math.sin(angle), Math.cos(angle), 0, 0]);
      multiply([1, 0, 0, 1, -cx, -cy]);
    }
  }
  return matrix;
}

function pathOperators(segments: readonly PathSegment[]): string {
  return segments.map((segment) => {
    switch (segment.kind) {
      case 'move': return `${num(segment.x)} ${num(segment.y)} m`;
      case 'line': return `${num(segment.x)} ${num(segment.y)} l`;
      case 'cubic': return `${num(segment.x1)} ${num(segment.y1)} ${num(segment.x2)} ${num(segment.y2)} ${num(segment.x)} ${num(segment.y)} c`;
      case 'close': return 'h';
    }
  }).join('\n');
}

/** The outline of a basic shape or path element as PDF path operators, or '' for other elements. */
function shapeOperators(node: SvgNode): string {
  switch (node.name) {
    case 'path': return pathOperators(svgPathSegments(node.attributes.d ?? ''));
    case 'rect': return `${num(numberAttribute(node, 'x'))} ${num(numberAttribute(node, 'y'))} ${num(numberAttribute(node, 'width'))} ${num(numberAttribute(node, 'height'))} re`;
    case 'line': return `${num(numberAttribute(node, 'x1'))} ${num(numberAttribute(node, 'y1'))} m ${num(numberAttribute(node, 'x2'))} ${num(numberAttribute(node, 'y2'))} l`;
    case 'circle': {
      const [cx, cy, r] = [numberAttribute(node, 'cx'), numberAttribute(node, 'cy'), numberAttribute(node, 'r')];
      const k = CIRCLE_HANDLE * r;
      return [`${num(cx + r)} ${num(cy)} m`, `${num(cx + r)} ${num(cy + k)} ${num(cx + k)} ${num(cy + r)} ${num(cx)} ${num(cy + r)} c`, `${num(cx - k)} ${num(cy + r)} ${num(cx - r)} ${num(cy + k)} ${num(cx - r)} ${num(cy)} c`,
        `${num(cx - r)} ${num(cy - k)} ${num(cx - k)} ${num(cy - r)} ${num(cx)} ${num(cy - r)} c`, `${num(cx + k)} ${num(cy - r)} ${num(cx + r)} ${num(cy - k)} ${num(cx + r)} ${num(cy)} c`, 'h'].join('\n');
    }
    default: return '';
  }
}

function escapePdfBytes(bytes: string): string {
  return bytes.replace(/[\\()]/g, (match) => `\\${match}`).replace(/\r/g, '\\r');
}

/** Unicode superscript characters and the plain characters the PDF draws raised and smaller in their place (the standard fonts lack most of them). */
const SUPERSCRIPT_CHARACTERS: Readonly<Record<string, string>> = {
  '\u2070': '0', '\u00b9': '1', '\u00b2': '2', '\u00b3': '3', '\u2074': '4', '\u2075': '5', '\u2076': '6', '\u2077': '7', '\u2078': '8', '\u2079': '9', '\u207b': '\u2212', '\u207a': '+',
};
/** Size and rise of a superscript, as fractions of the surrounding font size (the same as richTextToSvg's). */
const SUPERSCRIPT_SIZE_FRACTION = 0.72;
const SUPERSCRIPT_RISE_FRACTION = 0.36;

/** Splits text at Unicode superscript characters, which become raised, smaller plain characters. */
function withSuperscripts(piece: { text: string; sizePx: number; risePx: number }): { text: string; sizePx: number; risePx: number }[] {
  const pieces: { text: string; sizePx: number; risePx: number }[] = [];
  for (const character of piece.text) {
    const plain = SUPERSCRIPT_CHARACTERS[character];
    const next = plain === undefined
      ? { text: character, sizePx: piece.sizePx, risePx: piece.risePx }
      : { text: plain, sizePx: piece.sizePx * SUPERSCRIPT_SIZE_FRACTION, risePx: piece.risePx + piece.sizePx * SUPERSCRIPT_RISE_FRACTION };
    const last = pieces[pieces.length - 1];
    if (last && last.sizePx === next.sizePx && last.risePx === next.risePx) last.text += next.text;
    else pieces.push(next);
  }
  return pieces;
}

/** The text pieces of a `<text>` element: base text and `<tspan>` sub- and superscripts, with size (px) and rise (px, up). */
function textPieces(node: SvgNode, sizePx: number, risePx: number): { text: string; sizePx: number; risePx: number }[] {
  const pieces: { text: string; sizePx: number; risePx: number }[] = [];
  for (const child of node.children) {
    if (typeof child === 'string') pieces.push({ text: child, sizePx, risePx });
    else if (child.name === 'tspan') pieces.push(...textPieces(child, numberAttribute(child, 'font-size', sizePx), risePx + numberAttribute(child, 'baseline-shift', 0)));
  }
  return pieces;
}

class PdfPainter {
  readonly operators: string[] = [];
  readonly opacityStates = new Map<string, { fill: number; stroke: number }>();
  constructor(private readonly clipPaths: ReadonlyMap<string, SvgNode>, private readonly face: PdfTextFace) {}

  private opacity(fill: number, stroke: number): string {
    if (fill >= 1 && stroke >= 1) return '';
    const key = `${num(fill)} ${num(stroke)}`;
    let name = [...this.opacityStates].find(([, value]) => `${num(value.fill)} ${num(value.stroke)}` === key)?.[0];
    if (!name) {
      name = `A${this.opacityStates.size}`;
      this.opacityStates.set(name, { fill: Number(num(fill)), stroke: Number(num(stroke)) });
    }
    return `/${name} gs`;
  }

  private styleOf(node: SvgNode, parent: InheritedStyle): InheritedStyle {
    const a = node.attributes;
    const opacity = numberAttribute(node, 'opacity', 1);
    return {
      fill: a.fill ?? parent.fill,
      stroke: a.stroke ?? parent.stroke,
      strokeWidth: numberAttribute(node, 'stroke-width', parent.strokeWidth),
      fillOpacity: numberAttribute(node, 'fill-opacity', parent.fillOpacity) * opacity,
      strokeOpacity: numberAttribute(node, 'stroke-opacity', parent.strokeOpacity) * opacity,
      dash: a['stroke-dasharray'] ?? parent.dash,
      lineJoin: a['stroke-linejoin'] ?? parent.lineJoin,
      lineCap: a['stroke-linecap'] ?? parent.lineCap,
      fillRule: a['fill-rule'] ?? parent.fillRule,
      fontSizePx: numberAttribute(node, 'font-size', parent.fontSizePx),
      anchor: a['text-anchor'] ?? parent.anchor,
    };
  }

  private clip(reference: string | undefined): void {
    const id = /url\(#([^)]+)\)/.exec(reference ?? '')?.[1];
    const clipPath = id ? this.clipPaths.get(id) : undefined;
    if (!clipPath) return;
    const outlines = clipPath.children.filter((child): child is SvgNode => typeof child !== 'string').map(shapeOperators).filter((text) => text !== '');
    if (outlines.length === 0) return;
    const evenOdd = clipPath.children.some((child) => typeof child !== 'string' && child.attributes['clip-rule'] === 'evenodd');
    this.operators.push(outlines.join('\n'), evenOdd ? 'W* n' : 'W n');
  }

  private paintShape(node: SvgNode, style: InheritedStyle): void {
    const outline = shapeOperators(node);
    if (outline === '') return;
    const fill = style.fill === 'none' ? undefined : rgb(style.fill);
    const stroke = style.stroke === 'none' || !(style.strokeWidth > 0) ? undefined : rgb(style.stroke);
    if (!fill && !stroke) return;
    const setup: string[] = [];
    if (fill) setup.push(`${fill.map(num).join(' ')} rg`);
    if (stroke) {
      setup.push(`${stroke.map(num).join(' ')} RG`, `${num(style.strokeWidth)} w`, `${LINE_JOIN[style.lineJoin] ?? 0} j`, `${LINE_CAP[style.lineCap] ?? 0} J`);
      const dashes = style.dash === 'none' ? [] : style.dash.split(/[\s,]+/).map(Number).filter((value) => Number.isFinite(value) && value >= 0);
      setup.push(`[${dashes.map(num).join(' ')}] 0 d`);
    }
    const state = this.opacity(fill ? style.fillOpacity : 1, stroke ? style.strokeOpacity : 1);
    if (state) setup.push(state);
    const evenOdd = style.fillRule === 'evenodd';
    const paint = fill && stroke ? (evenOdd ? 'B*' : 'B') : fill ? (evenOdd ? 'f*' : 'f') : 'S';
    this.operators.push('q', ...setup, outline, paint, 'Q');
  }

  private paintText(node: SvgNode, style: InheritedStyle): void {
    const color = style.fill === 'none' ? undefined : rgb(style.fill);
    if (!color) return;
    const pieces = textPieces(node, style.fontSizePx, 0).flatMap(withSuperscripts).map((piece) => ({ ...piece, runs: pdfTextRuns(piece.text, this.face) }));
    const widthPx = pieces.reduce((total, piece) => total + piece.runs.reduce((sum, run) => sum + (run.widthPerMille / 1000) * piece.sizePx, 0), 0);
    const shift = style.anchor === 'middle' ? widthPx / 2 : style.anchor === 'end' ? widthPx : 0;
    const x = numberAttribute(node, 'x') - shift;
    const y = numberAttribute(node, 'y');
    const shows = pieces.flatMap((piece) => piece.runs.map((run) => `/${run.font === 'symbol' ? 'FS' : 'FL'} ${num(piece.sizePx)} Tf ${num(piece.risePx)} Ts (${escapePdfBytes(run.bytes)}) Tj`));
    const state = this.opacity(style.fillOpacity, 1);
    this.operators.push('q');
    if (node.attributes.transform) this.operators.push(`${transformMatrix(node.attributes.transform).map(num).join(' ')} cm`);
    this.operators.push(`${color.map(num).join(' ')} rg`, ...(state ? [state] : []), 'BT', `1 0 0 -1 ${num(x)} ${num(y)} Tm`, ...shows, 'ET', 'Q');
  }

  paint(node: SvgNode, parent: InheritedStyle): void {
    if (['title', 'desc', 'defs', 'clipPath', 'metadata', 'style'].includes(node.name)) return;
    const style = this.styleOf(node, parent);
    if (node.name === 'text') {
      this.paintText(node, style);
      return;
    }
    const grouping = node.name === 'g' || node.name === 'svg';
    const wrapped = Boolean(node.attributes['clip-path'] || (node.attributes.transform && node.name !== 'svg'));
    if (wrapped) {
      this.operators.push('q');
      if (node.attributes.transform) this.operators.push(`${transformMatrix(node.attributes.transform).map(num).join(' ')} cm`);
      this.clip(node.attributes['clip-path']);
    }
    if (grouping) {
      for (const child of node.children) {
        if (typeof child !== 'string') this.paint(child, style);
      }
    } else {
      this.paintShape(node, style);
    }
    if (wrapped) this.operators.push('Q');
  }
}

function collectClipPaths(node: SvgNode, into: Map<string, SvgNode>): Map<string, SvgNode> {
  if (node.name === 'clipPath' && node.attributes.id) into.set(node.attributes.id, node);
  for (const child of node.children) if (typeof child !== 'string') collectClipPaths(child, into);
  return into;
}

/**
 * Converts one of candela's SVG figures into a vector PDF of the same size
 * (1 px = 0.75 pt, so a 3.4 in wide figure is a 3.4 in wide page): paths,
 * rectangles, circles and lines with their fill, stroke, dash pattern, line
 * joins, fill rule and opacity (graphics states, ISO 32000-1 section 8.4.5),
 * clip paths, transforms, and text with sub- and superscripts set in the
 * standard fonts (Helvetica, or Times-Roman when the figure's font family
 * asks for a serif face, with Greek letters from Symbol), which PDF readers
 * provide, so no font is embedded. Elements outside candela's figure
 * vocabulary (images, gradients, patterns, filters) are skipped.
 *
 * Cost: O(size of the SVG).
 *
 * @param svg an SVG document written by a candela figure function
 * @returns the PDF file bytes
 * @throws CandelaError `figure.bad_svg` when the SVG cannot be read or has no positive width and height
 * @example svgToPdf(hubbleFigure(input)).subarray(0, 8).toString() // '%PDF-1.4'
 */
export function svgToPdf(svg: string): Buffer {
  const root = parseSvgTree(svg);
  const widthPx = numberAttribute(root, 'width');
  const heightPx = numberAttribute(root, 'height');
  if (!(widthPx > 0 && heightPx > 0)) {
    throw new CandelaError({ code: 'figure.bad_svg', message: 'the SVG root needs a positive width and height (px) for PDF output', found: `${root.attributes.width} x ${root.attributes.height}` });
  }
  const family = root.attributes['font-family'] ?? '';
  // The generic family at the end of the stack decides: `serif` gives Times-Roman, anything else Helvetica.
  const face: PdfTextFace = /(^|,)\s*serif\s*$/i.test(root.attributes['font-family'] ?? '') ? 'serif' : 'sans';
  const painter = new PdfPainter(collectClipPaths(root, new Map()), face);
  const title = root.children.find((child): child is SvgNode => typeof child !== 'string' && child.name === 'title');
  painter.operators.push(`${POINTS_PER_PX} 0 0 ${-POINTS_PER_PX} 0 ${num(heightPx * POINTS_PER_PX)} cm`);
  painter.paint(root, INITIAL_STYLE);
  return pdfFileBytes({
    widthPt: widthPx * POINTS_PER_PX,
    heightPt: heightPx * POINTS_PER_PX,
    content: `${painter.operators.join('\n')}\n`,
    opacityStates: painter.opacityStates,
    latinFont: face === 'serif' ? 'Times-Roman' : 'Helvetica',
    title: title ? title.children.filter((child): child is string => typeof child === 'string').join('') : 'candela figure',
  });
}
