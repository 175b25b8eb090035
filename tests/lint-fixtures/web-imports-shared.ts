// Linted as if it were apps/web/src/app/lint-probe.ts: what the web app may import.
import { signal } from '@angular/core';
import { materialSchema } from '@batchproof/shared';
import { probeHelper } from './lint-probe-helper';

export const probe = [signal, materialSchema, probeHelper];
