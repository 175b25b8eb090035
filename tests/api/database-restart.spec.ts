import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { errorEnvelopeSchema, healthSchema } from '@batchproof/shared';
import { createApp } from '../../apps/api/src/app';
import type { DatabaseHandle } from '../../apps/api/src/db/database';
import { TEST_APP_URL, TEST_JWT_SECRET } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { startMailCatcher } from '../support/mail-catcher';
import { openMigratedTestDatabase } from '../support/test-database';
import { startThrowawayCluster, type ThrowawayCluster } from '../support/throwaway-cluster';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

// The API on a cluster of this spec's own, so restarting it disturbs no other spec.
let cluster: ThrowawayCluster;
let handle: DatabaseHandle;
let mail: Awaited<ReturnType<typeof startMailCatcher>>;
let app: ReturnType<typeof createApp>;
let w: BuiltWorkshop;
beforeAll(async () => {
  cluster = await startThrowawayCluster();
  handle = await openMigratedTestDatabase(cluster.url);
  mail = await startMailCatcher();
  app = createApp({
    db: handle.db,
    mailer: mail.mailer,
    jwtSecret: TEST_JWT_SECRET,
    appUrl: TEST_APP_URL,
  });
  w = await buildWorkshop(handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
}, 60_000);
afterAll(async () => {
  await mail?.close();
  await handle?.close();
  cluster?.remove();
});

const listMaterials = () => request(app).get('/api/materials').set(bearer(w.members.owner));

describe('a PostgreSQL restart while the API holds idle connections', () => {
  it('answers 503 in the error envelope during the outage and 200 after, without an app restart', async () => {
    // Several requests at once leave several idle clients in the pool.
    const warm = await Promise.all(Array.from({ length: 4 }, listMaterials));
    expect(warm.map((r) => r.status)).toEqual([200, 200, 200, 200]);
    expect(handle.pool.idleCount).toBeGreaterThan(0);
    const errors = vi.spyOn(console, 'error').mockImplementation(() => {});
    vi.spyOn(console, 'log').mockImplementation(() => {});
    try {
      cluster.stop();

      const during = await listMaterials();
      expect(during.status).toBe(503);
      expect(errorEnvelopeSchema.parse(during.body).error.code).toBe('service_unavailable');
      const health = await request(app).get('/api/health');
      expect(health.status).toBe(503);
      expect(healthSchema.parse(health.body).database).toBe('down');

      cluster.start();

      expect((await listMaterials()).status).toBe(200);
      const healthAfter = await request(app).get('/api/health');
      expect(healthSchema.parse(healthAfter.body).database).toBe('up');

      // One line per failure, never a stack: every log call is a single line of text.
      const logged = errors.mock.calls;
      expect(logged.length).toBeGreaterThan(0);
      for (const call of logged) {
        expect(call).toHaveLength(1);
        expect(String(call[0])).not.toContain('\n');
      }
      expect(
        logged.filter(([line]) => String(line).startsWith('[db] connection lost')),
      ).toHaveLength(1);
    } finally {
      vi.restoreAllMocks();
    }
  });
});
