/**
 * One CSV field (RFC 4180): quoted when it holds a comma, a quote or a line
 * break, with quotes doubled. Private to the output layer.
 * @example csvField('a,b') // '"a,b"'
 */
export function csvField(value: string | number): string {
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
