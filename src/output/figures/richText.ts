/** One run of label text drawn at one baseline position. */
export interface TextSegment {
  text: string;
  /** `base` text, `sub`script or `super`script. */
  shift: 'base' | 'sub' | 'super';
}

/** Backslash commands that stand for one character (Unicode code points for the symbols of a TeX label). */
const SYMBOLS: Record<string, string> = {
  alpha: 'α', beta: 'β', gamma: 'γ', delta: 'δ', epsilon: 'ε', varepsilon: 'ε', zeta: 'ζ', eta: 'η',
  theta: 'θ', kappa: 'κ', lambda: 'λ', mu: 'μ', nu: 'ν', xi: 'ξ', pi: 'π', rho: 'ρ', sigma: 'σ',
  tau: 'τ', phi: 'φ', varphi: 'φ', chi: 'χ', psi: 'ψ', omega: 'ω',
  Gamma: 'Γ', Delta: 'Δ', Theta: 'Θ', Lambda: 'Λ', Xi: 'Ξ', Pi: 'Π', Sigma: 'Σ', Phi: 'Φ', Psi: 'Ψ', Omega: 'Ω',
  odot: '⊙', times: '×', pm: '±', circ: '°', ell: 'ℓ', infty: '∞', cdot: '·', approx: '≈', le: '≤', ge: '≥',
  ',': '\u2009', ';': ' ', ' ': ' ', '%': '%', '{': '{', '}': '}', '_': '_', '^': '^', '$': '$', '\\': '\\',
};

/** Commands that only set the font of their argument; the argument is kept, the command dropped. */
const FONT_COMMANDS = new Set(['rm', 'mathcal', 'mathrm', 'text', 'textrm', 'mathit', 'it', 'mathbf', 'bf', 'mathsf', 'operatorname']);

/**
 * Splits a label written in a small TeX subset into runs of base,
 * subscript and superscript text: Greek letters and a few symbols as
 * backslash commands (`\Omega`), `_x` / `_{...}` subscripts, `^x` / `^{...}`
 * superscripts, `{}` groups, font commands (`\rm`, `\mathrm{}`) dropped,
 * `$` ignored, and `-` in a sub- or superscript written as a minus sign.
 * Plain text passes through unchanged.
 *
 * Cost: one pass over the label.
 *
 * @param source label, e.g. `\Omega_{\rm m}` or `H_0 [km s^{-1} Mpc^{-1}]`
 * @returns the runs in reading order (adjacent runs with the same shift merged)
 * @example parseRichText('\\Omega_{\\rm m}') // [{ text: 'Ω', shift: 'base' }, { text: 'm', shift: 'sub' }]
 */
export function parseRichText(source: string): TextSegment[] {
  const segments: TextSegment[] = [];
  const push = (text: string, shift: TextSegment['shift']) => {
    if (text === '') return;
    const written = shift === 'base' ? text : text.replace(/-/g, '\u2212');
    const last = segments[segments.length - 1];
    if (last && last.shift === shift) last.text += written;
    else segments.push({ text: written, shift });
  };
  // Each open group remembers the shift it applies; a pending shift applies to the next token only.
  const groupShifts: TextSegment['shift'][] = ['base'];
  let pending: TextSegment['shift'] | undefined;
  let index = 0;
  while (index < source.length) {
    const character = source[index];
    const current = groupShifts[groupShifts.length - 1];
    const shift = pending ?? current;
    if (character === '_' || character === '^') {
      pending = character === '_' ? 'sub' : 'super';
      index++;
      continue;
    }
    if (character === '{') {
      groupShifts.push(shift);
      pending = undefined;
      index++;
      continue;
    }
    if (character === '}') {
      if (groupShifts.length > 1) groupShifts.pop();
      index++;
      continue;
    }
    if (character === '$') {
      index++;
      continue;
    }
    if (character === '\\') {
      const name = /^[A-Za-z]+/.exec(source.slice(index + 1))?.[0] ?? source[index + 1] ?? '';
      index += 1 + name.length;
      if (FONT_COMMANDS.has(name)) {
        // `\rm m` : skip the space that ends the command name.
        if (source[index] === ' ') index++;
        continue;
      }
      push(SYMBOLS[name] ?? name, shift);
      pending = undefined;
      continue;
    }
    push(character, shift);
    // A sign after `^` or `_` belongs to the script with the token after it: `^-1` reads as `^{-1}`.
    if (!(pending && (character === '-' || character === '+'))) pending = undefined;
    index++;
  }
  return segments;
}

/**
 * The label as plain Unicode text (scripts written inline), for titles and alt text.
 *
 * @param source label in candela's TeX subset
 * @returns plain text
 * @example richTextToPlain('\\Omega_{\\rm m}') // 'Ωm'
 */
export function richTextToPlain(source: string): string {
  return parseRichText(source).map((segment) => segment.text).join('');
}
