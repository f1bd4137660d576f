// data: reading supernova tables and covariance files; cuts. May import errors, math.
// the sample types
export type { SupernovaTable, CovarianceMatrix } from './supernovaTable.js';
export type { SystematicModes } from './supernovaTable.js';
export type { SupernovaField } from './supernovaField.js';
export { SUPERNOVA_FIELDS } from './supernovaField.js';
export { REQUIRED_FIELDS } from './supernovaField.js';
// supernova tables
export { readSupernovaTable } from './readSupernovaTable.js';
export type { TableReadOptions } from './readSupernovaTable.js';
export { DEFAULT_MAX_REDSHIFT_MISMATCH } from './checkSupernovaRows.js';
export { HUGE_MAGNITUDE_ERROR_MAG } from './checkSupernovaRows.js';
export { MAX_ISSUES_PER_CODE } from './issueList.js';
// covariance matrices
export { readCovarianceMatrix } from './readCovarianceMatrix.js';
export type { CovarianceReadOptions } from './readCovarianceMatrix.js';
export { DEFAULT_SYMMETRY_TOLERANCE } from './readCovarianceMatrix.js';
export { reorderLightCurveCovariance } from './reorderLightCurveCovariance.js';
export type { LightCurveParameter } from './reorderLightCurveCovariance.js';
export { CANONICAL_BLOCK_ORDER } from './reorderLightCurveCovariance.js';
export { subsetCovariance } from './subsetCovariance.js';
export { checkPositiveDefinite } from './checkPositiveDefinite.js';
export { readMeasurementCovariance } from './readMeasurementCovariance.js';
export { readTextLines } from './readTextLines.js';
// redshift lists (candela distances --z-file)
export { readRedshiftFile } from './readRedshiftFile.js';
// cuts and joining
export { applyCuts } from './applyCuts.js';
export type { CutOptions } from './applyCuts.js';
export type { CuttableError } from './applyCuts.js';
export { formatCutReport } from './cutReport.js';
export type { CutReport } from './cutReport.js';
export type { CutStep } from './cutReport.js';
export type { SampleCount } from './cutReport.js';
export { selectRows } from './selectRows.js';
export { concatenateTables } from './concatenateTables.js';
export { readSystematicModes } from './readSystematicModes.js';
export type { SystematicModeReadOptions } from './readSystematicModes.js';
export { subsetSystematicModes } from './subsetSystematicModes.js';
export { appendModeColumns } from './appendModeColumns.js';
export { withoutModeColumns } from './withoutModeColumns.js';
