export * from './figures.js';
export * from './format.js';
