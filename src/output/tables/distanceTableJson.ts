import type { DistanceTableFacts, DistanceTableRow } from './distanceTableFacts.js';

/** JSON key of each row field: snake_case with the unit last, as in every other JSON file candela writes. */
const ROW_KEYS: Record<keyof DistanceTableRow, string> = {
  z: 'z', expansionRate: 'expansion_rate', comovingDistanceMpc: 'comoving_distance_mpc',
  transverseComovingDistanceMpc: 'transverse_comoving_distance_mpc', luminosityDistanceMpc: 'luminosity_distance_mpc',
  angularDiameterDistanceMpc: 'angular_diameter_distance_mpc', distanceModulusMag: 'distance_modulus_mag',
  lookbackTimeGyr: 'lookback_time_gyr', ageGyr: 'age_gyr', decelerationParameter: 'deceleration_parameter',
};

/**
 * The table as one JSON object { model, today, rows } with full double precision
 * and snake_case keys (the model's densities under the parameter names omega_m,
 * omega_de, omega_k, omega_r, w0, wa, h0 in km/s/Mpc); infinite ages are null.
 * @param table the model, its facts and the rows.
 * @returns the JSON text, ending in a line break.
 * @throws nothing.
 * @example JSON.parse(distanceTableJson(table)).rows[0].distance_modulus_mag // => 44.1002...
 */
export function distanceTableJson(table: DistanceTableFacts): string {
  const { model, today } = table;
  const document = {
    model: {
      dark_energy: model.darkEnergy, flat: model.flat, omega_m: model.omegaMatter, omega_de: model.omegaDarkEnergy,
      omega_k: model.omegaCurvature, omega_r: model.omegaRadiation, w0: model.w0, wa: model.wa, h0: model.h0KmPerSPerMpc,
      cmb_temperature_k: model.cmbTemperatureK, effective_neutrino_species: model.effectiveNeutrinoSpecies, method: model.method,
    },
    today: {
      age_gyr: today.ageGyr, q0: today.q0, acceleration_redshift: today.accelerationRedshift,
      hubble_distance_mpc: today.hubbleDistanceMpc, hubble_time_gyr: today.hubbleTimeGyr,
    },
    rows: table.rows.map((row) => Object.fromEntries(Object.entries(ROW_KEYS).map(([field, key]) => [key, row[field as keyof DistanceTableRow]]))),
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}
