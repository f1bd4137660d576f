import type { StandardizationOptions } from '../../config/index.js';
import type { SupernovaTermOptions } from '../../likelihood/index.js';

/** The likelihood layer's standardization options from the configuration's `standardization` block. */
export function termStandardization(standardization: StandardizationOptions): SupernovaTermOptions['standardization'] {
  return {
    massStep: { ...standardization.hostMassStep },
    scatter: {
      lensingPerRedshift: standardization.scatter.lensingPerRedshift,
      peculiarVelocityKmPerS: standardization.scatter.peculiarVelocityKmPerS,
      includeRedshiftErrors: standardization.scatter.redshiftErrors,
    },
    intrinsicScatter: standardization.scatter.intrinsic,
    alphaBetaCovariance: standardization.alphaBetaCovariance,
    frozenAt: standardization.frozenAt ?? undefined,
  };
}
