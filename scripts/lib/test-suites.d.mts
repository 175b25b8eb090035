/** Types for `test-suites.mjs`, so the tooling specs can import it. */
export type SuiteNeed = 'database' | 'chromium' | 'webBuild';

export interface Suite {
  name: string;
  /** A vitest config, relative to the repository root. */
  config?: string;
  /** Whether the suite is `ng test`. */
  ng?: boolean;
  needs: SuiteNeed[];
}

export const SUITES: Suite[];

export function chooseSuites(names: string[]): { chosen: Suite[]; needs: Set<SuiteNeed> };
