export * from './roles';
export * from './errors';
export * from './auth';
export * from './people';
export * from './plans';
export * from './scenarios';
export * from './sign-off';
