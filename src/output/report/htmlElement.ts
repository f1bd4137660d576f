import { escapeXml } from '../figures/index.js';

/** HTML void elements (WHATWG HTML, section 13.1.2): written as `<x/>`, never with a closing tag. */
const VOID_ELEMENTS = new Set(['area', 'base', 'br', 'col', 'embed', 'hr', 'img', 'input', 'link', 'meta', 'source', 'track', 'wbr']);

/**
 * Builds one HTML element as text, in a form that is also well-formed XML:
 * void elements self-close (`<meta charset="utf-8"/>`), every other element
 * gets an explicit end tag even when empty (`<td></td>`, since `<td/>` is not
 * an empty cell in HTML). Attribute values are escaped; children are markup.
 *
 * @param name element name, e.g. `td`
 * @param attributes attribute values; `undefined` or `false` omits one, `true` writes `name="name"`
 * @param children markup inside the element (ignored for void elements)
 * @returns the element markup
 * @example htmlElement('td', { class: 'num' }, '1.00') // '<td class="num">1.00</td>'
 */
export function htmlElement(name: string, attributes: Record<string, string | number | boolean | undefined> = {}, children: string | readonly string[] = ''): string {
  let text = `<${name}`;
  for (const [key, value] of Object.entries(attributes)) {
    if (value === undefined || value === false) continue;
    text += ` ${key}="${escapeXml(value === true ? key : String(value))}"`;
  }
  if (VOID_ELEMENTS.has(name)) return `${text}/>`;
  return `${text}>${typeof children === 'string' ? children : children.join('')}</${name}>`;
}
