import { readFileSync } from 'node:fs';

/** Folder of the external diagnostics reference (R package posterior 1.4.0), relative to the repository root. */
export const DIAGNOSTICS_REFERENCE_DIR = '../shared/reference/diagnostics';

/** Reads a CSV with one column per chain (header line of chain names) into one Float64Array per chain. */
export function readChainColumns(path: string): Float64Array[] {
  const lines = readFileSync(path, 'utf8').trim().split(/\r?\n/);
  const chainCount = lines[0].split(',').length;
  const chains = Array.from({ length: chainCount }, () => new Float64Array(lines.length - 1));
  lines.slice(1).forEach((line, draw) => {
    line.split(',').forEach((cell, chain) => {
      chains[chain][draw] = Number(cell);
    });
  });
  return chains;
}

/** Reads a CSV whose `#` lines are comments into records keyed by the header names (numbers parsed when numeric). */
export function readRecords(path: string): Array<Record<string, string>> {
  const lines = readFileSync(path, 'utf8').split(/\r?\n/).filter((line) => line.trim() !== '' && !line.startsWith('#'));
  const header = lines[0].split(',');
  return lines.slice(1).map((line) => {
    const cells = line.split(',');
    return Object.fromEntries(header.map((name, index) => [name, cells[index]]));
  });
}
