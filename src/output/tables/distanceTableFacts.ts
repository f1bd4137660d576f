/** One row of a distance table: distances in Mpc, modulus in mag, times in Gyr; ageGyr is null for an infinite age. */
export interface DistanceTableRow {
  z: number;
  /** E(z) = H(z)/H0. */
  expansionRate: number;
  comovingDistanceMpc: number;
  transverseComovingDistanceMpc: number;
  luminosityDistanceMpc: number;
  angularDiameterDistanceMpc: number;
  distanceModulusMag: number;
  lookbackTimeGyr: number;
  ageGyr: number | null;
  decelerationParameter: number;
}

/** A distance table as the output formats print it: the model, its z-independent facts, the rows (plain values). */
export interface DistanceTableFacts {
  model: {
    /** Dark-energy law name (lambda, constant_w, cpl). */
    darkEnergy: string;
    flat: boolean;
    omegaMatter: number;
    omegaDarkEnergy: number;
    omegaCurvature: number;
    omegaRadiation: number;
    w0: number;
    wa: number;
    h0KmPerSPerMpc: number;
    /** 0 when radiation is off. */
    cmbTemperatureK: number;
    effectiveNeutrinoSpecies: number;
    /** How the distances were computed (closed form or quadrature). */
    method: string;
  };
  /** Age (Gyr, null when infinite), q0, the redshift where acceleration began (null: none below z = 1000), c/H0 (Mpc) and 1/H0 (Gyr). */
  today: { ageGyr: number | null; q0: number; accelerationRedshift: number | null; hubbleDistanceMpc: number; hubbleTimeGyr: number };
  rows: readonly DistanceTableRow[];
}

/** Column keys, short labels and units, in output order (shared by the text and CSV formats). */
export const DISTANCE_TABLE_COLUMNS: [keyof DistanceTableRow, string, string][] = [
  ['z', 'z', ''], ['expansionRate', 'H/H0', ''], ['comovingDistanceMpc', 'D_C', 'Mpc'],
  ['transverseComovingDistanceMpc', 'D_M', 'Mpc'], ['luminosityDistanceMpc', 'D_L', 'Mpc'],
  ['angularDiameterDistanceMpc', 'D_A', 'Mpc'], ['distanceModulusMag', 'mu', 'mag'],
  ['lookbackTimeGyr', 't_lookback', 'Gyr'], ['ageGyr', 't_age', 'Gyr'], ['decelerationParameter', 'q', ''],
];

