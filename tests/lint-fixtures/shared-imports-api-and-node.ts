// Linted as if it were libs/shared/src/lint-probe.ts: the shared library reaching into an app,
// the test data and Node.
import { randomUUID } from 'node:crypto';
import type { Database } from '../../../apps/api/src/db/database';
import { aMaterial } from '../../../fixtures/builders/material-builder';

export const probe: [typeof randomUUID, Database | undefined, typeof aMaterial] = [
  randomUUID,
  undefined,
  aMaterial,
];
