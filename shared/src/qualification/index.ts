export * from './checks.js';
export * from './nist-strd.js';
