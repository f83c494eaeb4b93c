export * from './checks.js';
export * from './nist-strd.js';
export * from './printed-tables.js';
