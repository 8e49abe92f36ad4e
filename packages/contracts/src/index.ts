export * from './roles';
export * from './errors';
export * from './auth';
export * from './people';
