import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { productIdentityRecordSchema } from '@batchproof/shared';
import { auditEvents } from '../../apps/api/src/db/schema';
import { aProductIdentity, aWorkshopLabelDetails } from '../../fixtures/builders/label-run-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { releasedFormula } from '../support/label-printing';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
});
afterAll(() => h.close());

describe('GET and PUT /api/formulas/:id/identity', () => {
  it('answers null until entered; the formulator saves it, every reader reads it back', async () => {
    const formulaId = await releasedFormula(h, w, null);
    const url = `/api/formulas/${formulaId}/identity`;
    const empty = await request(h.app).get(url).set(bearer(w.members.viewer));
    expect(empty.status).toBe(200);
    expect(productIdentityRecordSchema.parse(empty.body)).toEqual({
      formulaId,
      identity: null,
      updatedAt: null,
    });
    const saved = await request(h.app)
      .put(url)
      .set(bearer(w.members.formulator))
      .send(aProductIdentity({ productName: '  Orchard Fizzer  ', gtin: '' }));
    expect(saved.status).toBe(200);
    expect(saved.body.identity).toMatchObject({ productName: 'Orchard Fizzer', gtin: null });
    for (const who of [w.members.production, w.members.viewer, w.members.owner]) {
      const res = await request(h.app).get(url).set(bearer(who));
      expect(res.body).toEqual(saved.body);
    }
    expect((await request(h.app).get(url).set(bearer(w.members.assessor))).status).toBe(403);
  });

  it('refuses a wrong GTIN check digit with a field message, and logs each save', async () => {
    const formulaId = await releasedFormula(h, w, null);
    const url = `/api/formulas/${formulaId}/identity`;
    const bad = await request(h.app)
      .put(url)
      .set(bearer(w.members.owner))
      .send(aProductIdentity({ gtin: '09521234543214' }));
    expect(bad.status).toBe(400);
    // GS1 General Specifications: the check digit of 0952123454321 is 3
    expect(bad.body.error.fieldErrors.gtin[0]).toMatch(/check digit should be 3/);
    await request(h.app).put(url).set(bearer(w.members.owner)).send(aProductIdentity());
    await request(h.app)
      .put(url)
      .set(bearer(w.members.owner))
      .send(aProductIdentity({ productCode: 'TF-02' }));
    const events = await h.handle.db
      .select({ action: auditEvents.action })
      .from(auditEvents)
      .where(and(eq(auditEvents.workshopId, w.id), eq(auditEvents.subjectId, formulaId)))
      .orderBy(auditEvents.createdAt);
    expect(events.map((e) => e.action)).toEqual(
      expect.arrayContaining(['product-identity.created', 'product-identity.changed']),
    );
  });

  it('production and viewer may not write it; another workshop gets 404', async () => {
    const formulaId = await releasedFormula(h, w, null);
    const url = `/api/formulas/${formulaId}/identity`;
    for (const who of [w.members.production, w.members.viewer, w.members.assessor]) {
      expect((await request(h.app).put(url).set(bearer(who)).send(aProductIdentity())).status).toBe(
        403,
      );
    }
    const them = bearer(other.members.owner);
    expect((await request(h.app).get(url).set(them)).status).toBe(404);
    expect((await request(h.app).put(url).set(them).send(aProductIdentity())).status).toBe(404);
    expect((await request(h.app).get('/api/formulas/not-an-id/identity').set(them)).status).toBe(
      404,
    );
  });
});

describe('GET and PUT /api/workshop/label-details', () => {
  it('every role reads the name and address; only the owner changes them, and it is logged', async () => {
    const url = '/api/workshop/label-details';
    const before = await request(h.app).get(url).set(bearer(w.members.assessor));
    expect(before.status).toBe(200);
    expect(before.body).toEqual({ name: w.name, address: null });
    for (const who of [w.members.formulator, w.members.production, w.members.viewer]) {
      expect(
        (await request(h.app).put(url).set(bearer(who)).send(aWorkshopLabelDetails())).status,
      ).toBe(403);
    }
    const empty = await request(h.app)
      .put(url)
      .set(bearer(w.members.owner))
      .send({ name: 'Test Bathworks', address: '  ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fieldErrors).toHaveProperty('address');
    const saved = await request(h.app)
      .put(url)
      .set(bearer(w.members.owner))
      .send(aWorkshopLabelDetails());
    expect(saved.status).toBe(200);
    expect(saved.body).toEqual(aWorkshopLabelDetails());
    const read = await request(h.app).get(url).set(bearer(w.members.viewer));
    expect(read.body).toEqual(aWorkshopLabelDetails());
    const theirs = await request(h.app).get(url).set(bearer(other.members.owner));
    expect(theirs.body.address).toBeNull();
    const [event] = await h.handle.db
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.workshopId, w.id),
          eq(auditEvents.action, 'workshop.label-details-changed'),
        ),
      );
    expect(event?.actorId).toBe(w.members.owner.id);
  });
});
