export * from './schemas/common';
export * from './schemas/auth';
export * from './schemas/admin';
export * from './schemas/home';
export type * from './events';
export * from './schemas/tickets';
export * from './schemas/desk';
export * from './schemas/equipmentSpec';
export * from './schemas/readings';
