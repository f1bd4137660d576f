/** The tool version, written into every run's outputs. Keep in step with package.json. */
export const VERSION = '0.1.0';
