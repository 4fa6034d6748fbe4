export * from './auth';
export * from './clubs';
export * from './athletes';
export * from './screening';
export * from './invitation-athletes';
export * from './idempotency';
export * from './care';
export * from './rate-limits';
