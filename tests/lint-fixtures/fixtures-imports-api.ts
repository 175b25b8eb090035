// Linted as if it were fixtures/builders/lint-probe.ts: test data that writes to the database.
import bcrypt from 'bcryptjs';
import { z } from 'zod';
import { materials } from '../../apps/api/src/db/schema';
import { materialSchema } from '@batchproof/shared';

export const probe = [bcrypt, z, materials, materialSchema];
