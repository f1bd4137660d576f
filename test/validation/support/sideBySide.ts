// Validation helper (not a test): prints a measured figure next to its reference, so that a reader
// sees how far apart they are, not only whether a check passed.

/** One printed row: the quantity, what was measured, what it is compared with, the accepted range, and the source. */
export interface ComparisonRow {
  quantity: string;
  measured: string | number;
  reference: string | number;
  accepted?: string;
  source?: string;
}

const format = (value: string | number): string => (typeof value === 'number' ? Number(value.toPrecision(4)).toString() : value);

/**
 * Formats rows as an aligned plain-text table under a title (no colours, no borders).
 * @example comparisonTable('Pantheon', [{ quantity: 'omega_m mean', measured: 0.2975, reference: 0.298 }])
 */
export function comparisonTable(title: string, rows: readonly ComparisonRow[]): string {
  const header = ['quantity', 'measured', 'reference', 'accepted', 'source'];
  const cells = rows.map((row) => [row.quantity, format(row.measured), format(row.reference), row.accepted ?? '', row.source ?? '']);
  const widths = header.map((name, c) => Math.max(name.length, ...cells.map((line) => line[c].length)));
  const line = (values: string[]) => values.map((value, c) => value.padEnd(widths[c])).join('  ').trimEnd();
  return [`== ${title}`, line(header), ...cells.map(line)].join('\n');
}

/** Prints {@link comparisonTable} to the test log. */
export function printComparison(title: string, rows: readonly ComparisonRow[], notes: readonly string[] = []): void {
  console.log([comparisonTable(title, rows), ...notes.map((note) => `   ${note}`)].join('\n'));
}
