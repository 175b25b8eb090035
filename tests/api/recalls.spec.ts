import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RECALL_AUTHORITY_NOTE, recallPageSchema, recallSchema } from '@batchproof/shared';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { asBytes } from '../support/binary-body';
import { readPdf } from '../support/label-pdf-reader';
import { buildRecallScenario, type RecallScenario } from '../support/recall-scenario';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
let s: RecallScenario;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, {
    name: 'Gullcove Bath Works',
    roles: ['owner', 'viewer'],
  });
  s = await buildRecallScenario(h.handle.db, w.id);
});
afterAll(() => h.close());

const owner = () => bearer(w.members.owner);
const post = (path: string, body: object = {}) => request(h.app).post(path).set(owner()).send(body);

async function open(body: object) {
  const res = await post('/api/recalls', body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return recallSchema.parse(res.body);
}
const citricRecall = (drill: boolean) =>
  open({
    scope: { kind: 'supplier-lot', supplierLotId: s.citricLot.id },
    reason: 'The supplier recalled this citric acid lot: possible metal fragments.',
    severity: 'serious-harm',
    drill,
  });
const mailsTo = (to: string) => h.mail.received.filter((m) => m.to.includes(to.toLowerCase()));

async function pdfText(id: string) {
  const res = await asBytes(
    request(h.app).get(`/api/recalls/${id}/summary.pdf`).set(bearer(w.members.viewer)),
  );
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toBe('application/pdf');
  const pages = await readPdf(res.body as Buffer);
  return pages
    .flatMap((p) => p.texts.map((t) => t.str))
    .join(' ')
    .replace(/\s+/g, ' ');
}

describe('POST /api/recalls with a supplier lot', () => {
  it('traces the lot to its finished lots and the customers who received them, with units', async () => {
    const recall = await citricRecall(false);
    expect(recall.batchCodes).toEqual([s.f1.batchCode, s.f2.batchCode]);
    expect(recall.products).toEqual(['Sea Glass Fizzer']);
    expect(recall.state).toBe('open');
    expect(recall.drill).toBe(false);
    expect(recall.drillReport).toBeNull();
    expect(recall.affected.map((c) => [c.customerName, c.unitsDelivered])).toEqual([
      ['Harbour Soap Shop', 18],
      ['Tideline Market Stall', 5],
    ]);
    expect(recall.affected[0]!.lots).toEqual([
      {
        finishedLotId: s.f1.id,
        lotCode: s.f1.batchCode,
        productName: 'Sea Glass Fizzer',
        unitsDelivered: 18,
      },
    ]);
    expect(recall.unitsDelivered).toBe(23);
    expect(recall.unitsReturned).toBe(0);
  });

  it('previews the same answer before opening, naming the lot no delivery records', async () => {
    const res = await post('/api/recalls/preview', {
      scope: { kind: 'supplier-lot', supplierLotId: s.citricLot.id },
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      batchCodes: [s.f1.batchCode, s.f2.batchCode],
      unitsDelivered: 23,
      lotsWithoutDelivery: [s.f2.batchCode],
    });
    expect(res.body.affected.map((c: { customerName: string }) => c.customerName)).toEqual([
      'Harbour Soap Shop',
      'Tideline Market Stall',
    ]);
  });
});

describe('POST /api/recalls/:id/notices', () => {
  it('mails one notice per customer with e-mail, with the batch codes in subject and body; the customer without one is to be called', async () => {
    const recall = await citricRecall(false);
    const before = h.mail.received.length;
    const res = await post(`/api/recalls/${recall.id}/notices`, {
      whatToDo: 'We will collect the units on Friday.',
    });
    expect(res.status).toBe(200);
    const sent = recallSchema.parse(res.body);
    const mail = await h.mail.waitFor(s.harbour.email!);
    expect(mail.subject).toContain(s.f1.batchCode);
    expect(mail.subject).toContain('Sea Glass Fizzer');
    expect(mail.text).toContain(s.f1.batchCode);
    expect(mail.text).toContain('Dear Harbour Soap Shop,');
    expect(mail.text).toContain('Gullcove Bath Works is recalling Sea Glass Fizzer');
    expect(mail.text).toContain('possible metal fragments');
    expect(mail.text).toContain('We will collect the units on Friday.');
    expect(mail.text).toContain(w.members.owner.email);
    // Only the lots Harbour received are named; f2 went to nobody.
    expect(mail.text).not.toContain(s.f2.batchCode);
    expect(h.mail.received.length).toBe(before + 1);

    const byCustomer = new Map(sent.notices.map((n) => [n.customerId, n]));
    expect(byCustomer.get(s.harbour.id)).toMatchObject({
      status: 'sent',
      to: s.harbour.email,
      failure: null,
    });
    expect(byCustomer.get(s.harbour.id)!.sentAt).not.toBeNull();
    expect(byCustomer.get(s.tideline.id)).toMatchObject({
      status: 'not-sent',
      failure: 'No e-mail address: call 07700 900123',
      sentAt: null,
    });
    expect(sent.whatToDo).toBe('We will collect the units on Friday.');

    // Sending again sends nothing more to anyone.
    const again = await post(`/api/recalls/${recall.id}/notices`);
    expect(again.status).toBe(200);
    expect(mailsTo(s.harbour.email!)).toHaveLength(1);
    expect(h.mail.received.length).toBe(before + 1);
    expect(recallSchema.parse(again.body).notices).toHaveLength(2);
  });
});

describe('a recall drill', () => {
  it('reports the trace time and what a real recall would lack, and sends nothing', async () => {
    const drill = await citricRecall(true);
    expect(drill.drill).toBe(true);
    expect(drill.drillReport!.traceMilliseconds).toBeGreaterThanOrEqual(0);
    expect(drill.drillReport!.missing).toEqual([
      'Tideline Market Stall has no e-mail address: the notice would have to be phoned (07700 900123)',
      `Lot ${s.f2.batchCode} has no recorded delivery`,
      `Lot ${s.f2.batchCode} has no count of units made`,
    ]);
    const before = h.mail.received.length;
    const res = await post(`/api/recalls/${drill.id}/notices`);
    expect(res.status).toBe(200);
    const notices = recallSchema.parse(res.body).notices;
    expect(notices.map((n) => n.status)).toEqual(['drill', 'drill']);
    expect(notices.every((n) => n.sentAt === null)).toBe(true);
    expect(h.mail.received.length).toBe(before);

    const text = await pdfText(drill.id);
    expect(text).toContain('Recall drill summary');
    expect(text).toContain('Drill report');
    expect(text).toContain(`Lot ${s.f2.batchCode} has no recorded delivery`);
  });
});

describe('replies and closing', () => {
  it('adds up returned units, refuses more than a customer received, closes with a summary and prints it all', async () => {
    const recall = await citricRecall(false);
    await post(`/api/recalls/${recall.id}/notices`);
    const reply = (body: object) =>
      post(`/api/recalls/${recall.id}/replies`, {
        customerId: s.harbour.id,
        repliedOn: '2026-03-02',
        unitsOnHand: 10,
        unitsReturned: 8,
        ...body,
      });
    const first = await reply({ notes: 'Two sold before the notice.' });
    expect(first.status).toBe(201);
    expect(recallSchema.parse(first.body).unitsReturned).toBe(8);

    // Harbour received 18 and returned 8: 11 more would be 19.
    const tooMany = await reply({ unitsReturned: 11 });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fieldErrors.unitsReturned).toEqual([
      'Harbour Soap Shop received 18 units and already returned 8; at most 10 more can come back',
    ]);
    const notAffected = await reply({ customerId: s.kelp.id });
    expect(notAffected.status).toBe(400);
    expect(notAffected.body.error.fieldErrors.customerId).toEqual([
      'Choose a customer this recall affects',
    ]);
    const second = await post(`/api/recalls/${recall.id}/replies`, {
      customerId: s.tideline.id,
      repliedOn: '2026-03-03',
      unitsOnHand: 0,
      unitsReturned: 5,
    });
    expect(recallSchema.parse(second.body).unitsReturned).toBe(13);

    const closed = await post(`/api/recalls/${recall.id}/close`, {
      summary: 'Thirteen of twenty-three units came back; the rest were sold.',
    });
    expect(closed.status).toBe(200);
    const body = recallSchema.parse(closed.body);
    expect(body.state).toBe('closed');
    expect(body.closedAt).not.toBeNull();

    expect((await post(`/api/recalls/${recall.id}/close`, { summary: 'Again' })).status).toBe(409);
    expect((await reply({ unitsReturned: 0 })).status).toBe(409);
    expect((await post(`/api/recalls/${recall.id}/notices`)).status).toBe(409);

    const text = await pdfText(recall.id);
    for (const expected of [
      'Recall summary',
      'Gullcove Bath Works',
      s.f1.batchCode,
      s.f2.batchCode,
      'possible metal fragments',
      'Could cause serious harm',
      RECALL_AUTHORITY_NOTE,
      `Everything made with supplier lot ${s.citricLot.supplierLotNumber}`,
      'Harbour Soap Shop',
      'Tideline Market Stall',
      '13 returned of 23 delivered',
      'No e-mail address: call 07700 900123',
      'Two sold before the notice.',
      'Thirteen of twenty-three units came back; the rest were sold.',
      'Closed by Test owner',
    ]) {
      expect(text).toContain(expected);
    }
    expect(text).not.toContain('Drill report');
  });
});

describe('GET /api/recalls', () => {
  it('lists open recalls first, newest first, with units returned of delivered', async () => {
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const world = await buildRecallScenario(h.handle.db, other.id);
    const as = bearer(other.members.owner);
    const make = async (finishedLotIds: string[], severity: string) => {
      const res = await request(h.app)
        .post('/api/recalls')
        .set(as)
        .send({
          scope: { kind: 'finished-lots', finishedLotIds },
          reason: 'Cracked tops',
          severity,
        });
      expect(res.status).toBe(201);
      return res.body.id as string;
    };
    const a = await make([world.f3.id], 'unlikely-harm');
    const b = await make([world.f1.id], 'minor-harm');
    const c = await make([world.f1.id, world.f3.id], 'minor-harm');
    await request(h.app).post(`/api/recalls/${b}/close`).set(as).send({ summary: 'Done' });

    const list = await request(h.app).get('/api/recalls').set(as);
    expect(list.status).toBe(200);
    const page = recallPageSchema.parse(list.body);
    expect(page.total).toBe(3);
    expect(page.items.map((r) => r.id)).toEqual([c, a, b]);
    expect(page.items[0]).toMatchObject({
      batchCodes: [world.f1.batchCode, world.f3.batchCode],
      products: ['Sea Glass Fizzer'],
      customers: 3,
      unitsDelivered: 27,
      unitsReturned: 0,
      state: 'open',
    });
    const closedOnly = await request(h.app).get('/api/recalls?state=closed').set(as);
    expect(recallPageSchema.parse(closedOnly.body).items.map((r) => r.id)).toEqual([b]);
  });
});
