// The suites `npm test` knows and what each needs, so that the runner provisions only what the
// chosen suites need. Pure data and logic: importing this file provisions nothing.

/**
 * Every suite, in the order they run, with what it needs besides npm dependencies: `database` (a
 * fresh test database, its URL in TEST_DATABASE_URL), `chromium` (CHROMIUM_PATH) and `webBuild`
 * (the production web build in dist/web). `config` is a vitest config; `ng` runs `ng test`.
 */
export const SUITES = [
  { name: 'tooling', config: 'tests/tooling/vitest.config.ts', needs: [] },
  { name: 'shared', config: 'libs/shared/vitest.config.ts', needs: [] },
  { name: 'api', config: 'tests/api/vitest.config.ts', needs: ['database'] },
  { name: 'web', ng: true, needs: [] },
  {
    name: 'journeys',
    config: 'tests/journeys/vitest.config.ts',
    needs: ['database', 'chromium', 'webBuild'],
  },
];

/**
 * The suites named on the command line (all when none is), and the union of what they need.
 * Throws on a name that is not a suite.
 */
export function chooseSuites(names) {
  const unknown = names.filter((name) => !SUITES.some((suite) => suite.name === name));
  if (unknown.length)
    throw new Error(
      `No suite named ${unknown.join(', ')}. Suites: ${SUITES.map((s) => s.name).join(', ')}.`,
    );
  const chosen = names.length ? SUITES.filter((suite) => names.includes(suite.name)) : SUITES;
  return { chosen, needs: new Set(chosen.flatMap((suite) => suite.needs)) };
}
