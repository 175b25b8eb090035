import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { recallSchema } from '@batchproof/shared';
import { createApp } from '../../apps/api/src/app';
import type { DatabaseHandle } from '../../apps/api/src/db/database';
import type { Mailer } from '../../apps/api/src/mail/mailer';
import { TEST_APP_URL, TEST_JWT_SECRET } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { startMailCatcher } from '../support/mail-catcher';
import { buildRecallScenario } from '../support/recall-scenario';
import { openMigratedTestDatabase } from '../support/test-database';
import { buildWorkshop } from '../support/workshop-builder';

// The app with a mailer that refuses some addresses, as a mail server refusing a mailbox would.
let handle: DatabaseHandle;
let mail: Awaited<ReturnType<typeof startMailCatcher>>;
const refused = new Set<string>();
let app: ReturnType<typeof createApp>;
beforeAll(async () => {
  handle = await openMigratedTestDatabase();
  mail = await startMailCatcher();
  const mailer: Mailer = {
    send: (m) =>
      refused.has(m.to)
        ? Promise.reject(new Error('550 Mailbox unavailable'))
        : mail.mailer.send(m),
    close: () => mail.mailer.close(),
  };
  app = createApp({ db: handle.db, mailer, jwtSecret: TEST_JWT_SECRET, appUrl: TEST_APP_URL });
});
afterAll(async () => {
  await mail.close();
  await handle.close();
});

describe('POST /api/recalls/:id/notices when the mail server refuses one address', () => {
  it('records that notice as failed with the reason, sends the others, and a second send retries only the failed one', async () => {
    const w = await buildWorkshop(handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const s = await buildRecallScenario(handle.db, w.id);
    const as = bearer(w.members.owner);
    const opened = await request(app)
      .post('/api/recalls')
      .set(as)
      .send({
        scope: { kind: 'finished-lots', finishedLotIds: [s.f1.id, s.f3.id] },
        reason: 'Tops crumble in the bath.',
        severity: 'unlikely-harm',
      });
    expect(opened.status).toBe(201);
    const id = opened.body.id as string;
    refused.add(s.kelp.email!);

    const first = recallSchema.parse(
      (await request(app).post(`/api/recalls/${id}/notices`).set(as).send({})).body,
    );
    const status = (r: typeof first) =>
      Object.fromEntries(r.notices.map((n) => [n.customerId, [n.status, n.failure]]));
    expect(status(first)).toEqual({
      [s.harbour.id]: ['sent', null],
      [s.kelp.id]: ['failed', 'The mail server did not take it: 550 Mailbox unavailable'],
      [s.tideline.id]: ['not-sent', 'No e-mail address: call 07700 900123'],
    });
    await mail.waitFor(s.harbour.email!);
    expect(mail.received.filter((m) => m.to.includes(s.kelp.email!))).toHaveLength(0);

    refused.clear();
    const second = recallSchema.parse(
      (await request(app).post(`/api/recalls/${id}/notices`).set(as).send({})).body,
    );
    expect(status(second)[s.kelp.id]).toEqual(['sent', null]);
    const kelpMail = await mail.waitFor(s.kelp.email!);
    expect(kelpMail.subject).toContain(s.f3.batchCode);
    // Harbour got one notice, not two.
    expect(mail.received.filter((m) => m.to.includes(s.harbour.email!))).toHaveLength(1);
  });
});
