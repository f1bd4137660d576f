/**
 * run.json's text: the run record (of a fit, a nested-sampling fit, a merged
 * cluster run or an unblinded run) as JSON indented by two spaces, ending in
 * a line break. Keys keep the record's order. The one place run.json is
 * formatted, so every writer of it writes the same layout.
 * @param record the run record, JSON-ready (finite numbers or null).
 * @returns the file's text.
 * @throws nothing (a record with a cycle or a BigInt throws TypeError from JSON.stringify).
 * @example runJsonText({ run: { seed: 7 } }) // => '{\n  "run": {\n    "seed": 7\n  }\n}\n'
 */
export function runJsonText(record: object): string {
  return `${JSON.stringify(record, null, 2)}\n`;
}
