export * from './checks.js';
export * from './nist-strd.js';
export * from './printed-tables.js';
export * from './statistical-tables.js';
export * from './worked-examples.js';
