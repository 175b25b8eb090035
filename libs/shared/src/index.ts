export * from './errors/error-envelope';
export * from './auth/roles';
export * from './auth/auth-schema';
export * from './members/member-schema';
export * from './health/health-schema';
export * from './reference-lists/reference-list-schema';
export * from './reference-data/index';
export * from './compliance/index';
