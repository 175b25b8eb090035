// Linted as if it were apps/api/src/seed/lint-probe.ts: the API reaching into the web app and
// into the test data.
import { routes } from '../../../web/src/app/app.routes';
import { aMaterial } from '../../../../fixtures/builders/material-builder';

export const probe = [routes, aMaterial];
