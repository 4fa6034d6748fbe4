export * from './auth';
export * from './clubs';
export * from './athletes';
export * from './screening';
export * from './security';
export * from './storage';
