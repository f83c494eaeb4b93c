export * from './figures.js';
export * from './format.js';
export * from './statuses.js';
export * from './sections.js';
export * from './audit.js';
