export * from './auth.js';
export * from './farms.js';
export * from './register.js';
export * from './health.js';
export * from './exchange.js';
export * from './records.js';
export * from './versions.js';
