// Linted as if it were apps/web/src/app/lint-probe.ts: the web app reaching into the API.
import type { Database } from '../../../api/src/db/database';
import { materials } from '../../../../apps/api/src/db/schema';

export const probe: [Database | undefined, typeof materials] = [undefined, materials];
