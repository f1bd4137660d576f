// data: reading supernova tables and covariance files; cuts. May import errors, math.
export type { SupernovaTable, CovarianceMatrix } from './supernovaTable.js';
