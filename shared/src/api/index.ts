export * from './common.js';
export * from './users.js';
export * from './auth.js';
export * from './outbox.js';
export * from './methods.js';
export * from './studies.js';
export * from './reviews.js';
export * from './reports.js';
