// Test helper: a strict little XML 1.0 well-formedness checker that also builds a tree,
// so figure and report tests can count elements. Follows W3C XML 1.0 (5th ed.) sections
// 2.1-2.8 and 3.1 for what it accepts: one root element, balanced and properly nested tags,
// quoted unique attributes, no raw '<' or stray '&' in text or attribute values, only the
// five predefined entities or numeric character references. A DOCTYPE without an internal
// subset is accepted (the report page starts with <!DOCTYPE html>).

export interface XmlNode {
  name: string;
  attributes: Record<string, string>;
  children: XmlNode[];
  /** Text directly inside this element, entities decoded, concatenated. */
  text: string;
  /** Text runs and child elements in document order. */
  content: (string | XmlNode)[];
}

const NAME = /^[A-Za-z_:][A-Za-z0-9_:.-]*/;
const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

function decode(raw: string, where: number): string {
  if (raw.includes('<')) throw new Error(`raw '<' in text or attribute near offset ${where}`);
  return raw.replace(/&([^;]*);?/g, (whole, body: string) => {
    if (!whole.endsWith(';')) throw new Error(`unterminated entity '${whole}' near offset ${where}`);
    if (body in ENTITIES) return ENTITIES[body];
    const numeric = /^#(?:x([0-9a-fA-F]+)|([0-9]+))$/.exec(body);
    if (numeric) return String.fromCodePoint(numeric[1] ? Number.parseInt(numeric[1], 16) : Number(numeric[2]));
    throw new Error(`unknown entity '&${body};' near offset ${where}`);
  });
}

/** Parses `source` or throws an Error naming the first well-formedness problem and its offset. */
export function parseXml(source: string): XmlNode {
  let position = 0;
  const stack: XmlNode[] = [];
  let root: XmlNode | undefined;
  const fail = (message: string): never => {
    throw new Error(`${message} at offset ${position}: ${JSON.stringify(source.slice(position, position + 40))}`);
  };
  while (position < source.length) {
    if (source.startsWith('<?', position)) {
      const end = source.indexOf('?>', position);
      if (end < 0) fail('unterminated processing instruction');
      position = end + 2;
    } else if (source.startsWith('<!--', position)) {
      const end = source.indexOf('-->', position);
      if (end < 0) fail('unterminated comment');
      position = end + 3;
    } else if (source.startsWith('<![CDATA[', position)) {
      const end = source.indexOf(']]>', position);
      if (end < 0 || stack.length === 0) fail('bad CDATA section');
      const cdata = source.slice(position + 9, end);
      stack[stack.length - 1].text += cdata;
      stack[stack.length - 1].content.push(cdata);
      position = end + 3;
    } else if (source.startsWith('<!DOCTYPE', position)) {
      const end = source.indexOf('>', position);
      if (end < 0 || root || source.slice(position, end).includes('[')) fail('bad DOCTYPE');
      position = end + 1;
    } else if (source.startsWith('</', position)) {
      const name = NAME.exec(source.slice(position + 2))?.[0];
      if (!name) fail('bad end tag');
      const open = stack.pop();
      if (!open || open.name !== name) fail(`end tag </${name}> does not match <${open?.name ?? '(none)'}>`);
      position += 2 + (name as string).length;
      while (/\s/.test(source[position] ?? '')) position++;
      if (source[position] !== '>') fail('end tag not closed');
      position++;
    } else if (source[position] === '<') {
      const name = NAME.exec(source.slice(position + 1))?.[0];
      if (!name) fail('bad start tag');
      if (stack.length === 0 && root) fail('second root element');
      const node: XmlNode = { name: name as string, attributes: {}, children: [], text: '', content: [] };
      position += 1 + node.name.length;
      for (;;) {
        const spaced = /^\s+/.exec(source.slice(position));
        if (spaced) position += spaced[0].length;
        if (source.startsWith('/>', position) || source[position] === '>') break;
        if (!spaced) fail('attributes must be separated by white space');
        const attribute = NAME.exec(source.slice(position))?.[0];
        if (!attribute) fail('bad attribute name');
        position += (attribute as string).length;
        const equals = /^\s*=\s*/.exec(source.slice(position));
        if (!equals) fail(`attribute ${attribute} has no value`);
        position += (equals as RegExpExecArray)[0].length;
        const quote = source[position];
        if (quote !== '"' && quote !== "'") fail('attribute value not quoted');
        const end = source.indexOf(quote, position + 1);
        if (end < 0) fail('unterminated attribute value');
        if (Object.hasOwn(node.attributes, attribute as string)) fail(`duplicate attribute ${attribute}`);
        node.attributes[attribute as string] = decode(source.slice(position + 1, end), position);
        position = end + 1;
      }
      const selfClosing = source.startsWith('/>', position);
      position += selfClosing ? 2 : 1;
      if (stack.length) {
        stack[stack.length - 1].children.push(node);
        stack[stack.length - 1].content.push(node);
      }
      else root = node;
      if (!selfClosing) stack.push(node);
    } else {
      const next = source.indexOf('<', position);
      const end = next < 0 ? source.length : next;
      const raw = source.slice(position, end);
      if (stack.length === 0) {
        if (raw.trim() !== '') fail('text outside the root element');
      } else {
        const text = decode(raw, position);
        stack[stack.length - 1].text += text;
        stack[stack.length - 1].content.push(text);
      }
      position = end;
    }
  }
  if (stack.length) throw new Error(`unclosed element <${stack[stack.length - 1].name}>`);
  if (!root) throw new Error('no root element');
  return root;
}

/** Every element below (and including) `node` whose name matches, in document order. */
export function findAll(node: XmlNode, name: string, predicate: (candidate: XmlNode) => boolean = () => true): XmlNode[] {
  const found: XmlNode[] = [];
  const visit = (current: XmlNode) => {
    if (current.name === name && predicate(current)) found.push(current);
    current.children.forEach(visit);
  };
  visit(node);
  return found;
}

/** All text inside `node`, its descendants included, in document order. */
export function textContent(node: XmlNode): string {
  return node.content.map((part) => (typeof part === 'string' ? part : textContent(part))).join('');
}

/** Whether an element's class attribute lists `className`. */
export function hasClass(node: XmlNode, className: string): boolean {
  return (node.attributes.class ?? '').split(/\s+/).includes(className);
}
