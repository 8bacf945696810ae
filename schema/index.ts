export * from './users';
export * from './audit';
export * from './sessions';
export * from './species';
export * from './sources';
export * from './revisions';
export * from './releases';
export * from './outbox';
