import { readFileSync } from 'node:fs';
import path from 'node:path';
import { ESLint } from 'eslint';
import { beforeAll, describe, expect, it } from 'vitest';

// The files in tests/lint-fixtures cross a boundary on purpose, so `npm run lint` ignores them.
// Each is linted here with the project's own eslint.config.js, as if it lived in the folder whose
// rules it breaks (`filePath`), and must be refused for exactly the imports that cross.
const fixture = (name: string) => readFileSync(path.join('tests/lint-fixtures', name), 'utf8');

let eslint: ESLint;
beforeAll(() => {
  eslint = new ESLint({ cwd: process.cwd() });
});

/** The import sources `no-restricted-imports` reports, with the rule's message. */
async function refusedImports(name: string, filePath: string) {
  const code = fixture(name);
  const [result] = await eslint.lintText(code, { filePath });
  const lines = code.split('\n');
  return result!.messages
    .filter((m) => m.ruleId === 'no-restricted-imports')
    .map((m) => ({ source: /from '([^']+)'/.exec(lines[m.line - 1]!)![1], message: m.message }));
}

describe('npm run lint: import boundaries between folders', () => {
  it('refuses the web app importing the API, by either relative path', async () => {
    const refused = await refusedImports('web-imports-api.ts', 'apps/web/src/app/lint-probe.ts');
    expect(refused.map((r) => r.source)).toEqual([
      '../../../api/src/db/database',
      '../../../../apps/api/src/db/schema',
    ]);
    expect(refused[0]!.message).toContain('reaches the API over HTTP only');
  });

  it('refuses the web app importing Node built-ins (with or without node:) and fixtures/', async () => {
    const refused = await refusedImports(
      'web-imports-node-and-fixtures.ts',
      'apps/web/src/app/lint-probe.ts',
    );
    expect(refused.map((r) => r.source)).toEqual([
      'node:fs',
      'path',
      '../../../../fixtures/builders/material-builder',
    ]);
  });

  it('lets the web app import Angular, @batchproof/shared and its own files', async () => {
    expect(await refusedImports('web-imports-shared.ts', 'apps/web/src/app/lint-probe.ts')).toEqual(
      [],
    );
  });

  it('refuses the API importing the web app or fixtures/', async () => {
    const refused = await refusedImports(
      'api-imports-web-and-fixtures.ts',
      'apps/api/src/seed/lint-probe.ts',
    );
    expect(refused.map((r) => r.source)).toEqual([
      '../../../web/src/app/app.routes',
      '../../../../fixtures/builders/material-builder',
    ]);
  });

  it('refuses libs/shared importing Node, an app or fixtures/', async () => {
    const refused = await refusedImports(
      'shared-imports-api-and-node.ts',
      'libs/shared/src/lint-probe.ts',
    );
    expect(refused.map((r) => r.source)).toEqual([
      'node:crypto',
      '../../../apps/api/src/db/database',
      '../../../fixtures/builders/material-builder',
    ]);
  });

  it('refuses fixtures/ importing anything but @batchproof/shared', async () => {
    const refused = await refusedImports(
      'fixtures-imports-api.ts',
      'fixtures/builders/lint-probe.ts',
    );
    expect(refused.map((r) => r.source)).toEqual([
      'bcryptjs',
      'zod',
      '../../apps/api/src/db/schema',
    ]);
  });

  it('leaves the fixture files out of the normal lint run', async () => {
    expect(await eslint.isPathIgnored('tests/lint-fixtures/web-imports-api.ts')).toBe(true);
  });
});
