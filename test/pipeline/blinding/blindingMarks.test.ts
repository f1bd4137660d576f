import { describe, expect, it } from 'vitest';
import { blindingMarks, blindingMarksOfRuns } from '../../../src/pipeline/blinding/blindingMarks.js';
import type { RunBlindingSection } from '../../../src/pipeline/blinding/runBlinding.js';

const section = (state: RunBlindingSection['state']): RunBlindingSection => ({
  state, parameters: ['omega_m', 'w0'], offset_widths: { omega_m: 0.1, w0: 0.3 }, key_file: 'blinding.key', withheld: [], unblinded_at: state === 'blinded' ? null : '2026-12-04T12:00:00.000Z',
});
const table = '% Posterior summary\n\\begin{tabular}{lccc}\n\\hline\nrow \\\\\n\\end{tabular}\n';

describe('blindingMarks', () => {
  it('marks every kind of page of a blinded run', () => {
    const marks = blindingMarks({ blinding: section('blinded') });
    expect(marks.markdown('# Summary\n')).toBe('> BLINDED: omega_m, w0 are shown as true value + a secret offset (derived quantities, the Hubble-diagram model curve and probe model curves are withheld); candela unblind RUN shows the true values.\n\n# Summary\n');
    expect(marks.title('Run — flat_wcdm')).toBe('Run — flat_wcdm (BLINDED)');
    expect(marks.summaryJson({ schema: 's' })).toMatchObject({ schema: 's', blinding: { state: 'blinded', parameters: ['omega_m', 'w0'] } });
    const latex = marks.latex(table);
    expect(latex.startsWith('% BLINDED: omega_m, w0')).toBe(true);
    // A visible row spanning the four columns, just before the end of the table, with the underscore escaped for LaTeX.
    expect(latex).toContain('\\multicolumn{4}{l}{\\footnotesize \\textbf{BLINDED}: omega\\_m, w0 shown as true value + a secret offset} \\\\\n\\end{tabular}\n');
    expect(marks.svg('<svg xmlns="http://www.w3.org/2000/svg" width="100" height="50"><title>t</title>\n</svg>\n')).toContain('blinding-stamp');
  });

  it('leaves the pages of a run never blinded, or unblinded, as they are', () => {
    for (const record of [{}, { blinding: section('unblinded') }]) {
      const marks = blindingMarks(record);
      const document = { schema: 's' };
      expect(marks.summaryJson(document)).toBe(document);
      expect(marks.markdown('x')).toBe('x');
      expect(marks.latex(table)).toBe(table);
      expect(marks.svg('<svg/>')).toBe('<svg/>');
      expect(marks.title('t')).toBe('t');
    }
  });
});

describe('blindingMarksOfRuns', () => {
  it('marks a page of several runs when any is blinded, listing every blinded parameter once', () => {
    const one = { blinding: { ...section('blinded'), parameters: ['omega_m'] } };
    const two = { blinding: section('blinded') };
    expect(blindingMarksOfRuns([{}, one, two]).markdown('x')).toMatch(/^> BLINDED: omega_m, w0 are shown/);
    expect(blindingMarksOfRuns([{}, { blinding: section('unblinded') }]).title('Models')).toBe('Models');
  });
});
