import { CandelaError } from '../../errors.js';

/** A map from data values on one axis to SVG pixels. */
export interface AxisScale {
  /** `linear`, or `log` (base 10; data must be positive). */
  kind: 'linear' | 'log';
  /** Data range [first, last] (data units). */
  domain: [number, number];
  /** Pixel positions of domain[0] and domain[1] (px; reversed for a y axis). */
  rangePx: [number, number];
  /** Pixel position of a data value (px); values outside the domain extrapolate. */
  toPx(value: number): number;
}

/**
 * Creates a linear or base-10 logarithmic axis scale.
 *
 * @param kind `linear` or `log`
 * @param domain data range [first, last] (data units; both > 0 for `log`)
 * @param rangePx pixel positions of the two ends (px)
 * @returns the scale
 * @throws CandelaError `figure.bad_scale` when the domain is empty, not finite, or not positive on a log scale
 * @example createAxisScale('linear', [0, 1], [50, 250]).toPx(0.5) // 150
 */
export function createAxisScale(kind: 'linear' | 'log', domain: [number, number], rangePx: [number, number]): AxisScale {
  const [first, last] = domain;
  const invalid = !Number.isFinite(first) || !Number.isFinite(last) || first === last || (kind === 'log' && (first <= 0 || last <= 0));
  if (invalid) {
    throw new CandelaError({
      code: 'figure.bad_scale',
      message: `cannot build a ${kind} axis over this range`,
      expected: kind === 'log' ? 'two different positive finite numbers' : 'two different finite numbers',
      found: `[${first}, ${last}]`,
    });
  }
  const transform = kind === 'log' ? Math.log10 : (value: number) => value;
  const start = transform(first);
  const pixelsPerUnit = (rangePx[1] - rangePx[0]) / (transform(last) - start);
  return {
    kind,
    domain: [first, last],
    rangePx: [rangePx[0], rangePx[1]],
    toPx: (value: number) => rangePx[0] + (transform(value) - start) * pixelsPerUnit,
  };
}
