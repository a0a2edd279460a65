/**
 * Version of the computation engine, stored with every verdict so a stored result can be traced to
 * the formulas and default tolerances that produced it. Bump the minor version when a default
 * tolerance changes, the major version when a formula changes.
 */
export const ENGINE_VERSION = '1.0.0';
