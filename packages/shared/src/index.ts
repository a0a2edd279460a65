export * from './roles.ts';
export * from './permissions.ts';
export * from './errors.ts';
export * from './pagination.ts';
export * from './auth.ts';
export * from './mail.ts';
export * from './health.ts';
export * from './module-spec.ts';
