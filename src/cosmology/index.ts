// cosmology layer barrel: one FLRW core + small dark-energy laws. One export per line.

// Building a cosmology
export { createCosmology } from './createCosmology.js';
export type { CreateCosmologyOptions } from './createCosmology.js';
export type { Cosmology, CosmologyOutcome, CosmologyParameters } from './cosmology.js';
export { resolveCosmologyParameters, DEFAULT_EFFECTIVE_NEUTRINO_SPECIES } from './resolveCosmologyParameters.js';
export type { ResolvedCosmology } from './resolveCosmologyParameters.js';
export { cosmologyParametersFromValues } from './cosmologyFromValues.js';
export type { CosmologyFamily } from './cosmologyFromValues.js';
export { derivedCosmologyQuantities } from './derivedCosmologyQuantities.js';
export type { DerivedCosmologyQuantities } from './derivedCosmologyQuantities.js';
// Distance-modulus curves of parameter records (posterior draws) and their median and 68% band.
export { distanceModulusCurve, distanceModulusCurves } from './distanceModulusCurves.js';
export type { DistanceModulusCurveDraw, DistanceModulusCurveOptions } from './distanceModulusCurves.js';
export { distanceModulusBand } from './distanceModulusBand.js';
export type { DistanceModulusBand } from './distanceModulusBand.js';

// Dark-energy laws
export { darkEnergyEvolution } from './darkEnergyEvolution.js';
export type { DarkEnergyEvolution, DarkEnergyLaw } from './darkEnergyEvolution.js';
export { cosmologicalConstant } from './cosmologicalConstant.js';
export { constantEquationOfState } from './constantEquationOfState.js';
export { chevallierPolarskiLinder } from './chevallierPolarskiLinder.js';
export type { DarkEnergyLawDefinition } from './darkEnergyLawDefinition.js';
export { DARK_ENERGY_LAWS } from './darkEnergyLaws.js';
export { DARK_ENERGY_LAW_NAMES } from './darkEnergyLaws.js';
export { darkEnergyLaw } from './darkEnergyLaws.js';

// FLRW core pieces
export { squaredExpansionRate, decelerationParameter } from './densityBudget.js';
export type { DensityBudget } from './densityBudget.js';
export { radiationDensity, NEUTRINO_TO_PHOTON_PER_SPECIES } from './radiationDensity.js';
export type { RadiationDensity } from './radiationDensity.js';
export { transverseComovingDistance } from './transverseComovingDistance.js';
export { findExpansionFailure, scanExpansion } from './expansionFailure.js';
export type { ExpansionFailure, ExpansionScan } from './expansionFailure.js';
export { accelerationRedshift, ACCELERATION_SEARCH_MAX_REDSHIFT } from './accelerationRedshift.js';

// Early-universe scales: BAO distances, sound horizon, compressed CMB distances
export { CMB_TEMPERATURE_K } from './cosmologyConstants.js';
export { physicalRadiationDensity } from './physicalRadiationDensity.js';
export { baoDistances } from './baoDistances.js';
export type { BaoDistances } from './baoDistances.js';
export { baoDistanceRatios, BAO_DISTANCE_KINDS } from './baoDistanceRatios.js';
export type { BaoDistanceKind } from './baoDistanceRatios.js';
export { dragRedshift } from './dragRedshift.js';
export { dragSoundHorizonFitMpc } from './dragSoundHorizonFitMpc.js';
export { decouplingRedshift } from './decouplingRedshift.js';
export { comovingSoundHorizonMpc } from './comovingSoundHorizonMpc.js';
export { cmbShiftParameter } from './cmbShiftParameter.js';
export { acousticScale } from './acousticScale.js';
export { compressedCmbDistances } from './compressedCmbDistances.js';
export type { CompressedCmbDistances } from './compressedCmbDistances.js';
// Derived quantities of each sample (t0, q0, ...).
export { DERIVED_PARAMETER_MEANINGS } from './derivedParameters.js';
export type { DerivedModel } from './derivedParameters.js';
export { createDerivedParameters } from './derivedParameters.js';
// Supernova magnitudes and H0: M at another H0 giving the same magnitudes.
export { absoluteMagnitudeAtH0 } from './absoluteMagnitudeAtH0.js';
