export * from './figures.js';
