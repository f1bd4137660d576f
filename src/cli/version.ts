export { VERSION } from '../pipeline/index.js';
