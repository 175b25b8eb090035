// Linted as if it were apps/web/src/app/lint-probe.ts: Node built-ins and test data in the browser.
import { readFileSync } from 'node:fs';
import path from 'path';
import { aMaterial } from '../../../../fixtures/builders/material-builder';

export const probe = [readFileSync, path, aMaterial];
