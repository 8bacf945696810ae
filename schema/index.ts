export * from './users';
export * from './audit';
export * from './sessions';
