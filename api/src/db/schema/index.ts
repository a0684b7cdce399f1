export * from './branches';
export * from './accounts';
export * from './users';
export * from './system';
export * from './tickets';
export * from './articles';
export * from './tokens';
