import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { describe, expect, it } from 'vitest';

// The one-way import table of ../shared/STYLE.md ("Layout and layers"), extended
// with the mock-survey layer (numerical, below pipeline). A layer may import
// itself, errors.ts and the layers listed here; nothing else.
const ALLOWED: Record<string, string[]> = {
  errors: [],
  // parameters: the one registry of parameter names, units, symbols and default priors; a leaf every layer may ask.
  parameters: [],
  math: ['errors'],
  // config accepts exactly what the registries hold: it asks the parameter registry, the dark-energy
  // law registry (cosmology) and the probe registry (probes) instead of restating their lists, and uses
  // math for the text distance behind "did you mean". The numerical core still never sees the Config type.
  config: ['errors', 'math', 'parameters', 'cosmology', 'probes'],
  data: ['errors', 'math'],
  standardize: ['errors', 'math', 'data'],
  cosmology: ['errors', 'math', 'data', 'parameters'],
  likelihood: ['errors', 'math', 'data', 'standardize', 'cosmology', 'parameters'],
  // probes: likelihood terms beside the supernovae (BAO, compressed CMB), each a folder plus a registry line.
  probes: ['errors', 'math', 'data', 'cosmology', 'likelihood', 'parameters'],
  // forecast: Fisher-matrix numerics (Hessian of a log-likelihood, marginal errors, the covariance's own information); no Config type.
  forecast: ['errors', 'math', 'data', 'cosmology', 'likelihood', 'parameters'],
  mock: ['errors', 'math', 'data', 'standardize', 'cosmology', 'parameters'],
  sampler: ['errors', 'math'],
  diagnostics: ['errors', 'math'],
  compare: ['errors', 'math', 'sampler', 'diagnostics', 'parameters'],
  output: ['errors', 'math', 'sampler', 'diagnostics', 'parameters'],
  pipeline: ['errors', 'math', 'parameters', 'config', 'data', 'standardize', 'cosmology', 'likelihood', 'probes', 'mock', 'forecast', 'sampler', 'diagnostics', 'compare', 'output'],
  cli: ['errors', 'config', 'pipeline'],
};

// Layers below the pipeline that must stay free of process, console, clock and Math.random
// (data/ may read files, output/ may write them, the sampler's worker pool starts threads).
const PURE_LAYERS = ['parameters', 'math', 'standardize', 'cosmology', 'likelihood', 'mock', 'forecast', 'diagnostics', 'compare'];

function listFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? listFiles(path) : path.endsWith('.ts') ? [path] : [];
  });
}

function layerOf(file: string): string {
  const parts = relative('src', file).split(sep);
  return parts.length === 1 ? parts[0].replace(/\.(ts|js)$/, '') : parts[0];
}

const files = listFiles('src');

/** Every relative import or re-export of a source file that crosses into another layer (errors.ts excepted). */
function crossLayerImports(): Array<{ file: string; layer: string; specifier: string; target: string; targetLayer: string }> {
  const found: Array<{ file: string; layer: string; specifier: string; target: string; targetLayer: string }> = [];
  for (const file of files) {
    const layer = layerOf(file);
    for (const match of readFileSync(file, 'utf8').matchAll(/(?:import|export)[^'"]*?from\s+['"](\.[^'"]+)['"]/g)) {
      const target = join(file, '..', match[1]);
      const targetLayer = layerOf(target);
      if (targetLayer !== layer && targetLayer !== 'errors') found.push({ file, layer, specifier: match[1], target, targetLayer });
    }
  }
  return found;
}

describe('layer imports (../shared/STYLE.md table)', () => {
  it('every source file belongs to a known layer', () => {
    for (const file of files) expect(Object.keys(ALLOWED), file).toContain(layerOf(file));
  });

  it('no layer imports a layer above it', () => {
    const violations = crossLayerImports()
      .filter(({ layer, targetLayer }) => !ALLOWED[layer]?.includes(targetLayer))
      .map(({ file, specifier, layer, targetLayer }) => `${file} imports ${specifier} (${layer} -> ${targetLayer})`);
    expect(violations).toEqual([]);
  });

  it('a layer is imported from outside only through its index.ts barrel', () => {
    const violations = crossLayerImports()
      .filter(({ target }) => !/[/\\]index\.js$/.test(target))
      .map(({ file, specifier }) => `${file} imports ${specifier}`);
    expect(violations).toEqual([]);
  });

  it('the numerical layers use no process, console, clock or Math.random', () => {
    const violations: string[] = [];
    for (const file of files) {
      if (!PURE_LAYERS.includes(layerOf(file))) continue;
      const code = readFileSync(file, 'utf8').replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
      for (const pattern of [/\bprocess\./, /\bconsole\./, /\bDate\.now\b|\bnew Date\b/, /Math\.random/, /from ['"](node:)?fs['"]/]) {
        if (pattern.test(code)) violations.push(`${file}: ${pattern}`);
      }
    }
    expect(violations).toEqual([]);
  });
});
