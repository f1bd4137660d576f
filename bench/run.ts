/**
 * Benchmark runner: imports every suite file in this directory (a module that
 * exports `suite: BenchSuite`), runs them one after another (or only those
 * named on the command line), prints a table and writes one JSON object to
 * out/bench.json (relative to the working directory). See bench/README.md.
 *
 *   npm run bench                 # all suites
 *   node dist/bench/run.js distances
 */
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { availableParallelism, cpus, loadavg, totalmem } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { BenchSuite } from './suite.js';

const OUTPUT_FILE = join('out', 'bench.json');

async function loadSuites(): Promise<BenchSuite[]> {
  const here = dirname(fileURLToPath(import.meta.url));
  const files = readdirSync(here).filter((file) => /\.(js|ts)$/.test(file) && !/^(run|suite)\.(js|ts)$/.test(file) && !file.endsWith('.d.ts')).sort();
  const suites: BenchSuite[] = [];
  for (const file of files) {
    const module = (await import(pathToFileURL(join(here, file)).href)) as { suite?: BenchSuite };
    if (module.suite && typeof module.suite.run === 'function') suites.push(module.suite);
  }
  return suites;
}

function formatValue(value: number | string): string {
  if (typeof value === 'string') return value;
  if (Number.isInteger(value)) return String(value);
  return Math.abs(value) >= 1e-3 && Math.abs(value) < 1e6 ? value.toPrecision(4) : value.toExponential(2);
}

async function main(names: string[]): Promise<number> {
  const all = await loadSuites();
  const chosen = names.length ? all.filter((suite) => names.includes(suite.name)) : all;
  if (chosen.length === 0) {
    process.stderr.write(`no benchmark suite named ${names.join(', ')}; available: ${all.map((suite) => suite.name).join(', ')}\n`);
    return 2;
  }
  const loadBefore = loadavg();
  const results: Record<string, Record<string, number | string>> = {};
  for (const suite of chosen) {
    process.stdout.write(`running ${suite.name} ...\n`);
    results[suite.name] = await suite.run();
  }
  const rows = Object.entries(results).flatMap(([name, values]) => Object.entries(values).map(([key, value]) => [name, key, formatValue(value)]));
  const widths = [0, 1].map((column) => Math.max(...rows.map((row) => row[column].length), column ? 6 : 5));
  process.stdout.write(`\n${'suite'.padEnd(widths[0])}  ${'result'.padEnd(widths[1])}  value\n`);
  for (const [name, key, value] of rows) process.stdout.write(`${name.padEnd(widths[0])}  ${key.padEnd(widths[1])}  ${value}\n`);
  mkdirSync(dirname(OUTPUT_FILE), { recursive: true });
  const machine = {
    cpu_model: cpus()[0]?.model ?? 'unknown',
    cores: availableParallelism(),
    memory_gb: Number((totalmem() / 2 ** 30).toFixed(1)),
    load_average_1min_before: loadBefore[0],
    load_average_1min_after: loadavg()[0],
  };
  process.stdout.write(`\nmachine: ${machine.cpu_model}, ${machine.cores} cores, ${machine.memory_gb} GB, node ${process.version}; ` +
    `1-minute load average ${machine.load_average_1min_before.toFixed(2)} before, ${machine.load_average_1min_after.toFixed(2)} after\n`);
  const report = { node: process.version, platform: `${process.platform}-${process.arch}`, date: new Date().toISOString(), machine, suites: results };
  writeFileSync(OUTPUT_FILE, `${JSON.stringify(report, null, 2)}\n`);
  process.stdout.write(`\nwrote ${resolve(OUTPUT_FILE)}\n`);
  return 0;
}

main(process.argv.slice(2)).then((code) => { process.exitCode = code; }, (error: unknown) => {
  process.stderr.write(`benchmark failed: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
  process.exitCode = 1;
});
