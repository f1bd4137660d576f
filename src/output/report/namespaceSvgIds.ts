/**
 * Prefixes every `id` of an SVG document and every reference to one
 * (`url(#id)`, `href="#id"`, `xlink:href="#id"`), so several figures can be
 * inlined in one HTML page without their clip paths colliding (ids must be
 * unique in a document: WHATWG HTML, section 3.2.6.1).
 *
 * Cost: one pass over the text per pattern.
 *
 * @param svg SVG markup
 * @param prefix text put before every id (letters, digits, `-`, `_`)
 * @returns the markup with ids and references renamed
 * @example namespaceSvgIds('<clipPath id="c"/><g clip-path="url(#c)"/>', 'f1-') // '<clipPath id="f1-c"/><g clip-path="url(#f1-c)"/>'
 */
export function namespaceSvgIds(svg: string, prefix: string): string {
  return svg
    .replace(/(\sid=")([^"]+)"/g, (_, head: string, id: string) => `${head}${prefix}${id}"`)
    .replace(/url\(#([^)]+)\)/g, (_, id: string) => `url(#${prefix}${id})`)
    .replace(/((?:xlink:)?href=")#([^"]+)"/g, (_, head: string, id: string) => `${head}#${prefix}${id}"`);
}
