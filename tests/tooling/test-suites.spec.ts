import { describe, expect, it } from 'vitest';
import { chooseSuites, SUITES } from '../../scripts/lib/test-suites.mjs';

describe('npm test: choosing suites before provisioning', () => {
  it('when only the shared suite is chosen, needs no database, browser or build', () => {
    const { chosen, needs } = chooseSuites(['shared']);
    expect(chosen.map((suite) => suite.name)).toEqual(['shared']);
    expect([...needs]).toEqual([]);
  });

  it('when the api suite is chosen, needs a database only', () => {
    expect([...chooseSuites(['api']).needs]).toEqual(['database']);
  });

  it('when no suite is named, runs every suite and provisions what the journeys need', () => {
    const { chosen, needs } = chooseSuites([]);
    expect(chosen).toEqual(SUITES);
    expect([...needs].sort()).toEqual(['chromium', 'database', 'webBuild']);
  });

  it('when a name is not a suite, refuses it and lists the suites', () => {
    expect(() => chooseSuites(['shard'])).toThrow(/No suite named shard\. Suites: tooling, shared/);
  });
});
