/**
 * The absolute magnitude that gives the same supernova magnitudes when H0
 * changes. At low redshift m = M + 5 log10(c z / H0) + 25 (and D_L scales as
 * 1/H0 at every redshift), so magnitudes constrain only M - 5 log10 H0
 * (the M-H0 degeneracy of supernova cosmology, broken only by calibrators;
 * Riess et al. 2016, ApJ 826, 56, from memory); keeping it fixed gives
 * M' = M + 5 log10(H0' / H0).
 * Cost O(1).
 * @param absMagMag M at H0 = fromH0KmPerSPerMpc, mag.
 * @param fromH0KmPerSPerMpc the H0 M refers to, km/s/Mpc (> 0).
 * @param toH0KmPerSPerMpc the H0 wanted, km/s/Mpc (> 0).
 * @returns M', mag.
 * @throws nothing.
 * @example absoluteMagnitudeAtH0(-19.3, 70, 73) // -19.3 + 5 log10(73/70) = -19.20888
 */
export function absoluteMagnitudeAtH0(absMagMag: number, fromH0KmPerSPerMpc: number, toH0KmPerSPerMpc: number): number {
  return absMagMag + 5 * Math.log10(toH0KmPerSPerMpc / fromH0KmPerSPerMpc);
}
