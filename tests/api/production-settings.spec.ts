import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { productionSettingsSchema, ROLES, ROLE_SETS, type Role } from '@batchproof/shared';
import { auditEvents } from '../../apps/api/src/db/schema';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
});
afterAll(() => h.close());

const URL = '/api/workshop/production';
const settings = {
  weighingTolerancePercent: 1.5,
  batchCodePattern: '{CODE}-{YYMMDD}-{SEQ}',
  smallBusiness: true,
};

describe('GET /api/workshop/production', () => {
  it('answers the defaults for a new workshop: ±2 %, {YYMMDD}-{CODE}-{SEQ}, not a small business', async () => {
    const fresh = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const res = await request(h.app).get(URL).set(bearer(fresh.members.viewer));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      weighingTolerancePercent: 2,
      batchCodePattern: '{YYMMDD}-{CODE}-{SEQ}',
      smallBusiness: false,
    });
  });

  it.each(ROLES.map((r) => [r]))('as %s', async (role: Role) => {
    const res = await request(h.app).get(URL).set(bearer(w.members[role]));
    expect(res.status).toBe((ROLE_SETS.members as readonly Role[]).includes(role) ? 200 : 403);
  });

  it('anonymous is 401', async () => {
    expect((await request(h.app).get(URL)).status).toBe(401);
  });
});

describe('PUT /api/workshop/production', () => {
  it.each(ROLES.filter((r) => r !== 'owner').map((r) => [r]))(
    'as %s is 403 and changes nothing',
    async (role: Role) => {
      const before = (await request(h.app).get(URL).set(bearer(w.members.owner))).body;
      const res = await request(h.app).put(URL).set(bearer(w.members[role])).send(settings);
      expect(res.status).toBe(403);
      expect((await request(h.app).get(URL).set(bearer(w.members.owner))).body).toEqual(before);
    },
  );

  it('anonymous is 401', async () => {
    expect((await request(h.app).put(URL).send(settings)).status).toBe(401);
  });

  it('the owner sets them; members read them back; the change is in the audit log with before and after', async () => {
    const res = await request(h.app).put(URL).set(bearer(w.members.owner)).send(settings);
    expect(res.status).toBe(200);
    expect(productionSettingsSchema.parse(res.body)).toEqual(settings);
    const read = await request(h.app).get(URL).set(bearer(w.members.production));
    expect(read.body).toEqual(settings);
    const events = await h.handle.db
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.workshopId, w.id),
          eq(auditEvents.action, 'workshop.production-settings-changed'),
        ),
      );
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ actorId: w.members.owner.id, subjectId: w.id });
    expect(events[0]!.detail).toEqual({
      before: {
        weighingTolerancePercent: 2,
        batchCodePattern: '{YYMMDD}-{CODE}-{SEQ}',
        smallBusiness: false,
      },
      after: settings,
    });
  });

  it("another workshop's owner changes only their own workshop's settings", async () => {
    await request(h.app).put(URL).set(bearer(w.members.owner)).send(settings);
    const res = await request(h.app)
      .put(URL)
      .set(bearer(other.members.owner))
      .send({ ...settings, weighingTolerancePercent: 5, smallBusiness: false });
    expect(res.status).toBe(200);
    expect(res.body.weighingTolerancePercent).toBe(5);
    expect((await request(h.app).get(URL).set(bearer(w.members.viewer))).body).toEqual(settings);
  });

  it('refuses a tolerance outside 0.1–20 % and a pattern without a sequence with 400 field errors', async () => {
    const res = await request(h.app).put(URL).set(bearer(w.members.owner)).send({
      weighingTolerancePercent: 25,
      batchCodePattern: 'BATCH/{YYMMDD}',
      smallBusiness: 'yes',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.weighingTolerancePercent).toEqual([
      'The weighing tolerance must be 0.1 to 20 %',
    ]);
    expect(res.body.error.fieldErrors.batchCodePattern).toBeDefined();
    expect(res.body.error.fieldErrors.smallBusiness).toEqual([
      'Say whether the business is a small business',
    ]);
  });
});
