export * from './workshops';
export * from './users';
export * from './tokens';
export * from './audit';
export * from './reference';
