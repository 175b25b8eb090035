export * from './assessment-api';
export * from './safety-packet';
export * from './exposure-defaults';
export * from './readiness-api';
export * from './build-safety-packet';
export * from './substance-margins';
export * from './market-readiness';
