/**
 * Escapes text for use inside XML (and HTML) character data or a quoted
 * attribute value: `&`, `<`, `>`, `"` and `'` become entity references, and
 * the control characters that XML 1.0 forbids (W3C XML 1.0, section 2.2
 * "Characters") become U+FFFD so that the document always stays well formed.
 *
 * Cost: one pass over the text.
 *
 * @param text any string (user labels, file names, YAML)
 * @returns the escaped string
 * @example escapeXml('a < b & "c"') // 'a &lt; b &amp; &quot;c&quot;'
 */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']|[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, (character) => {
    switch (character) {
      case '&':
        return '&amp;';
      case '<':
        return '&lt;';
      case '>':
        return '&gt;';
      case '"':
        return '&quot;';
      case "'":
        return '&#39;';
      default:
        return '\uFFFD';
    }
  });
}
