import { describe, expect, it } from 'vitest';
import { errorsOf, lineOf } from './configTextHelpers.js';

// The hint printed for YAML syntax errors names the likely mistake. Which text is a
// syntax error, and where, follows the YAML 1.2 specification (yaml.org/spec/1.2.2,
// sections 6.1 indentation, 7.3 flow scalars, 7.4 flow collections); the position is
// the yaml package's. Each case is a small configuration broken in one place.
const BASE = 'title: "hint test"\nsupernovae:\n  - label: a\n    kind: magnitudes\n    table: { file: sn.txt }\n';

describe('YAML syntax hints', () => {
  it('calls a key indented less than its siblings an indentation error, not a bracket to close', () => {
    const text = BASE.replace('    table:', '   table:');
    const [issue, ...rest] = errorsOf(text);
    expect(rest).toEqual([]);
    expect(issue).toMatchObject({ code: 'config.yaml_syntax', line: lineOf(text, '   table:') });
    expect(issue.fix).toContain('indented less (3 spaces) than the line above (4)');
    expect(issue.fix).not.toMatch(/bracket|brace|close/);
  });

  it('calls a key indented more than its siblings an indentation error, once', () => {
    const text = `${BASE}sampler:\n  walkers: 8\n    max_steps: 10\n`;
    const issues = errorsOf(text);
    expect(issues).toHaveLength(1);
    expect(issues[0].line).toBe(lineOf(text, '    max_steps'));
    expect(issues[0].fix).toContain('indented more (4 spaces) than the line above (2)');
  });

  it('asks to close an unclosed flow sequence, brace and quote', () => {
    expect(errorsOf(`${BASE}models: [a, b\nseed: 3\n`)[0].fix).toContain('close the "[" opened on this line');
    expect(errorsOf(BASE.replace('sn.txt }', 'sn.txt'))[0].fix).toContain('close the "{" opened on this line');
    expect(errorsOf(BASE.replace('"hint test"', '"hint test'))[0].fix).toContain('close the quote');
  });

  it('asks for the colon of a key written without one', () => {
    const text = `${BASE}seed 3\n`;
    expect(errorsOf(text)[0].fix).toContain('"key: value"');
  });
});
