import { CandelaError } from '../errors.js';
import { SPEED_OF_LIGHT_KM_PER_S, MEGAPARSEC_KM, GIGAYEAR_S } from '../math/index.js';
import { accelerationRedshift } from './accelerationRedshift.js';
import { closedFormIntegrals } from './closedFormIntegrals.js';
import type { Cosmology, CosmologyParameters } from './cosmology.js';
import { decelerationParameter, squaredExpansionRate } from './densityBudget.js';
import type { DensityBudget } from './densityBudget.js';
import { dominantHighRedshiftPower, findExpansionFailure } from './expansionFailure.js';
import { numericalExpansionIntegrals } from './expansionIntegrals.js';
import type { ExpansionIntegrals } from './expansionIntegrals.js';
import { transverseComovingDistance } from './transverseComovingDistance.js';

/**
 * The FLRW core: owns E(z) and every distance and time; the dark-energy law
 * only supplies w(z) and its density. Formulas follow Hogg 1999
 * (arXiv:astro-ph/9905116): D_C = D_H int dz/E, D_M from D_C (eq. 16),
 * D_L = (1+z) D_M, D_A = D_M/(1+z), mu = 5 log10(D_L / 10 pc), lookback and age
 * from int dz/((1+z)E). Closed forms replace the quadrature where they exist,
 * chosen once here. Built by createCosmology, which has already checked
 * E^2 > 0 on [0, maxRedshift].
 */
export class FlrwCosmology implements Cosmology {
  readonly omegaMatter: number;
  readonly omegaDarkEnergy: number;
  readonly omegaCurvature: number;
  readonly omegaRadiation: number;
  readonly hubbleDistanceMpc: number;
  readonly hubbleTimeGyr: number;
  readonly method: string;
  private readonly integrals: ExpansionIntegrals;
  private bigBang: boolean | undefined;
  private todayAgeGyr: number | undefined;
  private acceleration: number | null | undefined;

  constructor(readonly parameters: Required<CosmologyParameters>, private readonly budget: DensityBudget,
    readonly maxRedshift: number, useClosedForms: boolean, dipSingularityDistanceLn = Infinity) {
    this.omegaMatter = budget.matter;
    this.omegaDarkEnergy = budget.darkEnergy;
    this.omegaCurvature = budget.curvature;
    this.omegaRadiation = budget.radiation;
    this.hubbleDistanceMpc = SPEED_OF_LIGHT_KM_PER_S / parameters.h0KmPerSPerMpc;
    this.hubbleTimeGyr = MEGAPARSEC_KM / parameters.h0KmPerSPerMpc / GIGAYEAR_S;
    this.integrals = { ...numericalExpansionIntegrals(budget, dipSingularityDistanceLn), ...(useClosedForms ? closedFormIntegrals(budget) : {}) };
    this.method = this.integrals.method;
  }

  get hasBigBang(): boolean {
    if (this.bigBang === undefined) {
      const positive = this.maxRedshift === Infinity || findExpansionFailure(this.budget, Infinity) === null;
      this.bigBang = positive && dominantHighRedshiftPower(this.budget) > 0;
    }
    return this.bigBang;
  }

  expansionRate(z: number): number {
    this.checkRedshift(z);
    return Math.sqrt(squaredExpansionRate(this.budget, Math.log1p(z), 1 + z));
  }

  equationOfState(z: number): number {
    this.checkRedshift(z);
    return this.budget.law.equationOfState(z);
  }

  comovingDistanceMpc(z: number): number {
    this.checkRedshift(z);
    return this.hubbleDistanceMpc * this.integrals.comovingHubble(z);
  }

  transverseComovingDistanceMpc(z: number): number {
    this.checkRedshift(z);
    return this.hubbleDistanceMpc * transverseComovingDistance(this.integrals.comovingHubble(z), this.omegaCurvature);
  }

  luminosityDistanceMpc(z: number, zHelio = z): number {
    this.checkHeliocentric(zHelio);
    return (1 + zHelio) * this.transverseComovingDistanceMpc(z);
  }

  angularDiameterDistanceMpc(z: number): number {
    return this.transverseComovingDistanceMpc(z) / (1 + z);
  }

  distanceModulusMag(z: number, zHelio = z): number {
    return 5 * Math.log10(Math.abs(this.luminosityDistanceMpc(z, zHelio))) + 25;
  }

  lookbackTimeGyr(z: number): number {
    this.checkRedshift(z);
    return this.hubbleTimeGyr * this.integrals.lookbackHubble(z);
  }

  ageGyr(z: number): number {
    this.checkRedshift(z);
    return this.hasBigBang ? this.hubbleTimeGyr * this.integrals.ageHubble(z) : Infinity;
  }

  get ageTodayGyr(): number {
    if (this.todayAgeGyr === undefined) this.todayAgeGyr = this.ageGyr(0);
    return this.todayAgeGyr;
  }

  decelerationParameter(z: number): number {
    this.checkRedshift(z);
    return decelerationParameter(this.budget, z);
  }

  get q0(): number {
    return decelerationParameter(this.budget, 0);
  }

  accelerationRedshift(): number | null {
    if (this.acceleration === undefined) this.acceleration = accelerationRedshift(this.budget, this.maxRedshift);
    return this.acceleration;
  }

  transverseComovingDistancesHubbleUnits(sortedRedshifts: Float64Array, out: Float64Array): void {
    const count = sortedRedshifts.length;
    if (out.length < count) throw new RangeError(`output holds ${out.length} values, ${count} needed`);
    let previous = 0;
    for (let i = 0; i < count; i++) {
      const z = sortedRedshifts[i];
      if (!(z >= previous)) {
        if (z >= 0) throw unsortedError(i, z, previous);
        this.checkRedshift(z);
      }
      previous = z;
    }
    if (count > 0) this.checkRedshift(sortedRedshifts[count - 1]);
    this.integrals.comovingHubbleSorted(sortedRedshifts, out, count);
    const curvature = this.omegaCurvature;
    for (let i = 0; i < count; i++) out[i] = transverseComovingDistance(out[i], curvature);
  }

  comovingDistancesMpc(z: Float64Array, out = new Float64Array(z.length)): Float64Array {
    return this.sortedSweep(z, out, false);
  }

  transverseComovingDistancesMpc(z: Float64Array, out = new Float64Array(z.length)): Float64Array {
    return this.sortedSweep(z, out, true);
  }

  distanceModuliMag(z: Float64Array, zHelio?: Float64Array, out = new Float64Array(z.length)): Float64Array {
    if (zHelio && zHelio.length !== z.length) throw new RangeError(`zHelio has ${zHelio.length} values, z has ${z.length}`);
    this.transverseComovingDistancesMpc(z, out);
    for (let i = 0; i < z.length; i++) {
      const helio = zHelio ? zHelio[i] : z[i];
      this.checkHeliocentric(helio);
      out[i] = 5 * Math.log10(Math.abs((1 + helio) * out[i])) + 25;
    }
    return out;
  }

  /** Sorts once (unless already ascending), sweeps cumulatively, scatters back in the caller's order. */
  private sortedSweep(z: Float64Array, out: Float64Array, transverse: boolean): Float64Array {
    const count = z.length;
    if (out.length < count) throw new RangeError(`output holds ${out.length} values, ${count} needed`);
    let ascending = true;
    for (let i = 0; i < count; i++) {
      this.checkRedshift(z[i]);
      if (i > 0 && z[i] < z[i - 1]) ascending = false;
    }
    const order = ascending ? null : Uint32Array.from({ length: count }, (_, i) => i).sort((a, b) => z[a] - z[b]);
    const sorted = order ? Float64Array.from(order, (index) => z[index]) : z;
    const values = order ? sorted : out;
    this.integrals.comovingHubbleSorted(sorted, values, count);
    for (let i = 0; i < count; i++) {
      const chi = values[i];
      const distance = this.hubbleDistanceMpc * (transverse ? transverseComovingDistance(chi, this.omegaCurvature) : chi);
      if (order) out[order[i]] = distance;
      else out[i] = distance;
    }
    return out;
  }

  private checkRedshift(z: number): void {
    if (Number.isFinite(z) && z >= 0 && z <= this.maxRedshift) return;
    throw new CandelaError({
      code: 'cosmology.redshift_out_of_range',
      message: `redshift ${z} is outside the range this cosmology was checked for`,
      path: 'z',
      expected: `a finite redshift in [0, ${this.maxRedshift}]`,
      found: String(z),
      fix: z > this.maxRedshift ? 'create the cosmology with a larger maxRedshift' : 'use redshifts >= 0',
    });
  }

  private checkHeliocentric(zHelio: number): void {
    if (Number.isFinite(zHelio) && zHelio > -1) return;
    throw new CandelaError({
      code: 'cosmology.heliocentric_redshift_invalid', message: `heliocentric redshift ${zHelio} is not usable`,
      path: 'zHelio', expected: 'a finite number > -1', found: String(zHelio), fix: 'check the heliocentric redshift column',
    });
  }
}

function unsortedError(index: number, z: number, previous: number): CandelaError {
  return new CandelaError({
    code: 'cosmology.redshifts_not_sorted', message: `redshift ${index} (${z}) is smaller than the one before it (${previous})`,
    path: 'z', expected: 'redshifts sorted ascending', found: String(z), fix: 'sort the redshifts, or use comovingDistancesMpc/transverseComovingDistancesMpc, which accept any order',
  });
}
