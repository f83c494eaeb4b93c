export * from './figures.js';
export * from './format.js';
export * from './statuses.js';
export * from './sections.js';
export * from './comparisons.js';
export * from './study-changes.js';
export * from './audit.js';
export * from './runs.js';
