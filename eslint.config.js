// @ts-check
import { builtinModules } from 'node:module';
import js from '@eslint/js';
import angular from 'angular-eslint';
import tseslint from 'typescript-eslint';

/**
 * The folders' boundaries. A relative path only says where it leads at a known depth, so a folder
 * is matched wherever its name appears in the import (`../../../fixtures/demo`), and a sibling
 * app also by the relative form that leaves its own app (`../../../api/src/db` from apps/web).
 */
const forbid = {
  api: {
    regex: String.raw`(^|/)apps/api(/|$)|^(\.\./)+api/src(/|$)`,
    message: 'The web app reaches the API over HTTP only; shared code lives in @batchproof/shared.',
  },
  web: {
    regex: String.raw`(^|/)apps/web(/|$)|^(\.\./)+web/src(/|$)`,
    message: 'The API never imports the web app; shared code lives in @batchproof/shared.',
  },
  apps: {
    regex: String.raw`(^|/)apps(/|$)`,
    message: 'This folder may not import the apps.',
  },
  fixtures: {
    regex: String.raw`(^|/)fixtures(/|$)`,
    message:
      'fixtures/ holds test data for tests only; the demo seed data lives in apps/api/src/seed.',
  },
  tests: {
    regex: String.raw`(^|/)tests(/|$)`,
    message: 'This folder may not import the tests.',
  },
  sharedByPath: {
    regex: String.raw`(^|/)libs/shared(/|$)`,
    message: 'Import the shared library as @batchproof/shared.',
  },
  nodeScheme: {
    regex: '^node:',
    message: 'Node built-ins are not available here: this code also runs in the browser.',
  },
  packages: {
    regex: String.raw`^(?!@batchproof/shared$|node:)[^./]`,
    message: 'fixtures/ may import @batchproof/shared only (plain typed data).',
  },
};
const nodeBuiltins = builtinModules
  .filter((name) => !name.startsWith('_'))
  .map((name) => ({ name, message: forbid.nodeScheme.message }));
const boundary = (files, patterns, paths = []) => ({
  files,
  rules: { 'no-restricted-imports': ['error', { paths, patterns }] },
});

export default tseslint.config(
  {
    ignores: [
      'dist/**',
      '.angular/**',
      '.data/**',
      'node_modules/**',
      'test-output/**',
      'drizzle/**',
      // Files that cross a boundary on purpose; tests/tooling/import-boundaries.spec.ts lints them.
      'tests/lint-fixtures/**',
    ],
  },
  {
    files: ['**/*.ts'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/no-non-null-assertion': 'off',
      'no-restricted-syntax': [
        'error',
        {
          // The named export is one object holding every locale, so the web bundle keeps them all.
          selector:
            "ImportDeclaration[source.value='zod'][importKind='value'] > ImportSpecifier[imported.name='z']",
          message:
            "Import zod as `import * as z from 'zod'`, which lets the build drop what is unused.",
        },
      ],
    },
  },
  {
    files: ['apps/web/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/directive-selector': [
        'error',
        { type: 'attribute', prefix: 'bp', style: 'camelCase' },
      ],
      '@angular-eslint/component-selector': [
        'error',
        { type: 'element', prefix: 'bp', style: 'kebab-case' },
      ],
    },
  },
  {
    files: ['apps/web/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  // Boundaries (DEVELOPERS.md): web → shared; api → shared; shared → nothing of ours and no Node;
  // fixtures → shared only. tests/tooling/import-boundaries.spec.ts checks these rules.
  boundary(
    ['apps/web/**/*.ts'],
    [forbid.api, forbid.fixtures, forbid.tests, forbid.sharedByPath, forbid.nodeScheme],
    nodeBuiltins,
  ),
  boundary(['apps/api/**/*.ts'], [forbid.web, forbid.fixtures, forbid.sharedByPath]),
  boundary(
    ['libs/shared/src/**/*.ts', 'libs/shared/bench/**/*.ts'],
    [forbid.apps, forbid.fixtures, forbid.tests, forbid.nodeScheme],
    nodeBuiltins,
  ),
  boundary(
    ['fixtures/**/*.ts'],
    [forbid.apps, forbid.tests, forbid.sharedByPath, forbid.nodeScheme, forbid.packages],
  ),
  {
    files: ['scripts/**/*.mjs', '*.js'],
    extends: [js.configs.recommended],
    languageOptions: {
      globals: {
        process: 'readonly',
        console: 'readonly',
        fetch: 'readonly',
        setTimeout: 'readonly',
        clearTimeout: 'readonly',
        URL: 'readonly',
      },
    },
  },
);
