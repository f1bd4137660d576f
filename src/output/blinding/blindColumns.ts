/**
 * Shown values of a blinded run: each blinded column plus its offset.
 */

/**
 * Adds each parameter's offset to its column (copies; the input is not
 * changed). Columns without an offset are shared as they are; -Infinity and
 * NaN stay what they are (a missing value stays missing).
 * Cost: O(rows x blinded columns).
 * @param columns values per column name, in each parameter's unit.
 * @param offsets offset per blinded parameter, same unit (drawBlindingOffsets).
 * @returns the shown columns.
 * @throws nothing.
 * @example blindColumns({ w0: Float64Array.of(-1) }, { w0: 0.2 }).w0[0] // -0.8
 */
export function blindColumns(columns: Readonly<Record<string, Float64Array>>, offsets: Readonly<Record<string, number>>): Record<string, Float64Array> {
  const shown: Record<string, Float64Array> = {};
  for (const [name, values] of Object.entries(columns)) {
    const offset = offsets[name];
    shown[name] = offset === undefined ? values : values.map((value) => value + offset);
  }
  return shown;
}

/**
 * The same for one set of named values (a best fit).
 * @param values value per parameter name.
 * @param offsets offset per blinded parameter.
 * @returns the shown values, same keys in the same order.
 * @throws nothing.
 * @example blindValues({ w0: -1, alpha: 0.14 }, { w0: 0.2 }) // { w0: -0.8, alpha: 0.14 }
 */
export function blindValues(values: Readonly<Record<string, number>>, offsets: Readonly<Record<string, number>>): Record<string, number> {
  return Object.fromEntries(Object.entries(values).map(([name, value]) => [name, offsets[name] === undefined ? value : value + offsets[name]]));
}
