import { escapeXml } from './escapeXml.js';
import { formatPixels } from './formatPixels.js';

/** An attribute value: numbers are written as pixels (two decimals); `undefined`, `null` and `false` omit the attribute. */
export type AttributeValue = string | number | undefined | null | false;

/**
 * Builds one XML element as text: `<name a="1">children</name>`, or
 * `<name a="1"/>` when there are no children. Attribute values are escaped;
 * children are inserted as they are (they are already markup, build text
 * children with {@link escapeXml}).
 *
 * @param name element name, e.g. `path`
 * @param attributes attribute names and values (order kept)
 * @param children markup placed inside the element
 * @returns the element markup
 * @example svgElement('rect', { width: 10, fill: 'none' }) // '<rect width="10" fill="none"/>'
 */
export function svgElement(name: string, attributes: Record<string, AttributeValue>, children?: string | readonly string[]): string {
  let text = `<${name}`;
  for (const [key, value] of Object.entries(attributes)) {
    if (value === undefined || value === null || value === false) continue;
    const written = typeof value === 'number' ? formatPixels(value) : escapeXml(value);
    text += ` ${key}="${written}"`;
  }
  const inner = children === undefined ? '' : typeof children === 'string' ? children : children.join('');
  return inner === '' ? `${text}/>` : `${text}>${inner}</${name}>`;
}
