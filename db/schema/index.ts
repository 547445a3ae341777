export * from './audit.ts';
export * from './crew.ts';
export * from './sequences.ts';
export * from './uploads.ts';
export * from './users.ts';
export * from './plans.ts';
export * from './robustness.ts';
export * from './recordings.ts';
