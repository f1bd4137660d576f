import { describe, expect, it } from 'vitest';
import { modelsPageIsCurrent } from '../../../src/pipeline/fit/finalModelsIndex.js';

// The rule is a statement about the order of events (each model's outputs start when its final run.json is written,
// and it rewrites the models page before its process ends); checked here on hand-made timelines (ms). The pages
// themselves are compared byte for byte with a fit in turn in fitSideBySide.test.ts.
const done = (outputsFromMs: number, endedAtMs: number) => ({ finished: true, outputsFromMs, endedAtMs });

describe('modelsPageIsCurrent', () => {
  it('holds when the last model to write its outputs started them after every other model had ended', () => {
    expect(modelsPageIsCurrent([done(10, 20), done(30, 40)])).toBe(true);
    expect(modelsPageIsCurrent([done(50, 60), done(10, 20), done(30, 45)])).toBe(true);
  });

  it('fails when output phases overlap: a model may have read a sibling that was not yet final', () => {
    expect(modelsPageIsCurrent([done(10, 35), done(30, 40)])).toBe(false);
    expect(modelsPageIsCurrent([done(10, 30), done(30, 40)])).toBe(false);
  });

  it('fails when a model did not finish or left no run.json, and for fewer than two models', () => {
    expect(modelsPageIsCurrent([done(10, 20), { finished: false, outputsFromMs: 30, endedAtMs: 40 }])).toBe(false);
    expect(modelsPageIsCurrent([done(10, 20), { finished: true, outputsFromMs: null, endedAtMs: 40 }])).toBe(false);
    expect(modelsPageIsCurrent([done(10, 20)])).toBe(false);
  });
});
