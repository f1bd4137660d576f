import { resolve, join } from 'node:path';
import { writeFileSync, mkdirSync, readFileSync } from 'node:fs';
import { it } from 'vitest';
import { runFit } from '../../src/pipeline/index.js';
it('smoke', async () => {
const dataFolder = resolve('../shared/data-real/pantheon2018/Binned_data');
const scratch = resolve('.candela-tmp/smoke');
mkdirSync(scratch, { recursive: true });
const path = join(scratch, 'nested.yaml');
writeFileSync(path, `title: "nested smoke"
seed: 5
supernovae:
  - label: bins
    kind: magnitudes
    table: { file: ${join(dataFolder, 'lcparam_DS17f.txt')}, delimiter: whitespace }
    columns: { id: name, z: zcmb, z_helio: zhel, magnitude: mb, magnitude_err: dmb }
    covariances:
      - { file: ${join(dataFolder, 'sys_DS17f.txt')}, applies_to: magnitudes }
standardization:
  scatter: { intrinsic: off, lensing_per_redshift: 0, peculiar_velocity_km_s: 0, redshift_errors: false }
models:
  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }
  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }
parameters:
  w0: { prior: uniform, min: -2.5, max: -0.3 }
sampler: { method: nested, nested: { live_points: 200, dlogz: 0.1 } }
output: { dir: ${join(scratch, 'out')}, png: true }
`);
const t = performance.now();
const outcomes = await runFit({ configPath: path, force: true, onLine: (l) => console.log(l) });
console.log((performance.now() - t).toFixed(0), 'ms');
console.log(readFileSync(join(outcomes[1].runDir, 'summary.json'), 'utf8').slice(0, 3000));
}, 120000);
import { compareRuns } from '../../src/pipeline/index.js';
it('compare smoke', () => {
  const scratch = resolve('.candela-tmp/smoke');
  const t = performance.now();
  const outcome = compareRuns({ runDirs: [join(scratch, 'out/flat_lcdm'), join(scratch, 'out/flat_wcdm')], outDir: join(scratch, 'cmp') });
  console.log((performance.now() - t).toFixed(0), 'ms', outcome.files, outcome.warnings);
  console.log(readFileSync(join(scratch, 'cmp/comparison.md'), 'utf8'));
}, 120000);
