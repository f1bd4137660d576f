import { CandelaError } from '../../../errors.js';

/** One element of a parsed SVG document: its name, attributes and children (elements or text). */
export interface SvgNode {
  name: string;
  attributes: Readonly<Record<string, string>>;
  children: readonly (SvgNode | string)[];
}

const NAMED_ENTITIES: Readonly<Record<string, string>> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

function decodeEntities(text: string): string {
  return text.replace(/&(#x[0-9a-f]+|#[0-9]+|[a-z]+);/gi, (whole, body: string) => {
    if (body[0] === '#') {
      const code = body[1] === 'x' || body[1] === 'X' ? Number.parseInt(body.slice(2), 16) : Number.parseInt(body.slice(1), 10);
      return Number.isFinite(code) ? String.fromCodePoint(code) : whole;
    }
    return NAMED_ENTITIES[body] ?? whole;
  });
}

function malformed(detail: string): CandelaError {
  return new CandelaError({ code: 'figure.bad_svg', message: `the SVG could not be read for PDF output: ${detail}` });
}

/**
 * Parses the XML of an SVG document into a tree: elements with their
 * attributes (entities decoded) and text children. It reads the subset of
 * XML 1.0 (W3C 2008) that candela's figures are written in: elements,
 * double- or single-quoted attributes, character and the five predefined
 * entity references, comments and an optional XML declaration; no DTD and
 * no CDATA.
 *
 * Cost: O(length of the text).
 *
 * @param text an SVG document
 * @returns the root element
 * @throws CandelaError `figure.bad_svg` for text that is not well formed
 * @example parseSvgTree('<svg width="10"><path d="M0 0"/></svg>').children[0] // { name: 'path', attributes: { d: 'M0 0' }, children: [] }
 */
export function parseSvgTree(text: string): SvgNode {
  const tagPattern = /<!--[\s\S]*?-->|<\?[\s\S]*?\?>|<\/([\w:.-]+)\s*>|<([\w:.-]+)((?:\s+[\w:.-]+\s*=\s*(?:"[^"]*"|'[^']*'))*)\s*(\/?)>/g;
  const attributePattern = /([\w:.-]+)\s*=\s*(?:"([^"]*)"|'([^']*)')/g;
  const root: { name: string; attributes: Record<string, string>; children: (SvgNode | string)[] } = { name: '#document', attributes: {}, children: [] };
  const stack = [root];
  let position = 0;
  for (let match = tagPattern.exec(text); match; match = tagPattern.exec(text)) {
    const between = text.slice(position, match.index);
    if (between.includes('<')) throw malformed(`unexpected '<' near character ${position + between.indexOf('<')}`);
    if (between.trim() !== '') stack[stack.length - 1].children.push(decodeEntities(between));
    position = tagPattern.lastIndex;
    const [whole, closing, opening, attributeText, selfClosing] = match;
    if (whole.startsWith('<!--') || whole.startsWith('<?')) continue;
    if (closing) {
      const open = stack.pop();
      if (!open || open === root || open.name !== closing) throw malformed(`closing tag </${closing}> does not match`);
      continue;
    }
    const attributes: Record<string, string> = {};
    for (const pair of attributeText.matchAll(attributePattern)) attributes[pair[1]] = decodeEntities(pair[2] ?? pair[3] ?? '');
    const node = { name: opening, attributes, children: [] as (SvgNode | string)[] };
    stack[stack.length - 1].children.push(node);
    if (!selfClosing) stack.push(node);
  }
  if (text.slice(position).includes('<')) throw malformed('an unfinished tag at the end');
  if (stack.length !== 1) throw malformed(`<${stack[stack.length - 1].name}> is never closed`);
  const element = root.children.find((child): child is SvgNode => typeof child !== 'string');
  if (!element || element.name !== 'svg') throw malformed('the document has no <svg> root element');
  return element;
}
