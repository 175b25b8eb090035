export * from './reference-row';
export * from './us-colour-additives';
export * from './eu-annex-iv-colourants';
export * from './eu-annex-iii-allergens';
export * from './required-warnings';
export * from './reference-lists';
