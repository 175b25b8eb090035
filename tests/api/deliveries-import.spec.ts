import { readFileSync } from 'node:fs';
import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  deliveryImportPreviewSchema,
  deliveryImportResultSchema,
  deliveryPageSchema,
} from '@batchproof/shared';
import { aCustomer } from '../../fixtures/builders/delivery-builder';
import { auditEvents } from '../../apps/api/src/db/schema';
import { buildFinishedLot, buildReleasedFormula } from '../support/finished-lot-builder';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

const fixture = (name: string) =>
  readFileSync(new URL(`../../fixtures/deliveries/${name}`, import.meta.url), 'utf8');
const GOOD = fixture('deliveries-import.csv');
const ONE_BAD_ROW = fixture('deliveries-import-one-bad-row.csv');

let h: ApiHarness;

beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

/**
 * A workshop with the fixture's customers (Larkspur Pantry, Tidewell Market Stall) and finished
 * lots (IMP-FZ-01: 40 made; IMP-SB-02: units made not known).
 */
async function importWorkshop(): Promise<BuiltWorkshop> {
  const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'production'] });
  for (const [name, kind] of [
    ['Larkspur Pantry', 'stockist'],
    ['Tidewell Market Stall', 'market-stall'],
  ] as const) {
    const res = await request(h.app)
      .post('/api/customers')
      .set(bearer(w.members.owner))
      .send(aCustomer({ name, kind }));
    expect(res.status).toBe(201);
  }
  const f = await buildReleasedFormula(h.handle.db, w.id, { name: 'Harbour Fizzer' });
  await buildFinishedLot(h.handle.db, w.id, { ...f, batchCode: 'IMP-FZ-01', unitsMade: 40 });
  await buildFinishedLot(h.handle.db, w.id, { ...f, batchCode: 'IMP-SB-02', unitsMade: null });
  return w;
}

const upload = (w: BuiltWorkshop, path: string, csv: string) =>
  request(h.app)
    .post(`/api/deliveries/import${path}`)
    .set(bearer(w.members.production))
    .attach('file', Buffer.from(csv), 'deliveries.csv');
const deliveriesOf = async (w: BuiltWorkshop) => {
  const res = await request(h.app)
    .get('/api/deliveries?sort=deliveredOn')
    .set(bearer(w.members.owner));
  return deliveryPageSchema.parse(res.body);
};

describe('POST /api/deliveries/import/preview', () => {
  it('checks every row against the workshop and groups them into deliveries, saving nothing', async () => {
    const w = await importWorkshop();
    const res = await upload(w, '/preview', GOOD);
    expect(res.status).toBe(200);
    const preview = deliveryImportPreviewSchema.parse(res.body);
    expect(preview).toMatchObject({
      fileErrors: [],
      rowCount: 3,
      validCount: 3,
      errorCount: 0,
      deliveryCount: 2,
      commitable: true,
    });
    // Rows 2 and 3 share customer (case and spaces folded), day and reference: one delivery.
    expect(preview.deliveries).toEqual([
      {
        customer: 'Larkspur Pantry',
        deliveredOn: '2026-02-02',
        reference: 'INV-2001',
        lines: [2, 3],
        totalUnits: 36,
      },
      {
        customer: 'Tidewell Market Stall',
        deliveredOn: '2026-02-03',
        reference: null,
        lines: [4],
        totalUnits: 6,
      },
    ]);
    expect((await deliveriesOf(w)).total).toBe(0);
  });

  it('names the bad row’s problem and says the file cannot be committed', async () => {
    const w = await importWorkshop();
    const preview = deliveryImportPreviewSchema.parse(
      (await upload(w, '/preview', ONE_BAD_ROW)).body,
    );
    expect(preview.commitable).toBe(false);
    expect(preview.errorCount).toBe(1);
    expect(preview.rows.find((r) => r.line === 4)?.errors).toEqual({
      lot_code: ['No finished lot with the code "NO-SUCH-LOT" in this workshop'],
    });
  });

  it('counts the units already delivered and those earlier in the file against the units made', async () => {
    const w = await importWorkshop();
    expect((await upload(w, '', GOOD)).status).toBe(201); // 30 of IMP-FZ-01's 40 delivered
    const csv = [
      'delivered_on,customer,lot_code,units',
      '2026-02-05,Larkspur Pantry,IMP-FZ-01,8', // 8 of the 10 left
      '2026-02-06,Larkspur Pantry,IMP-FZ-01,3', // 3 > the 2 left
    ].join('\n');
    const preview = deliveryImportPreviewSchema.parse((await upload(w, '/preview', csv)).body);
    expect(preview.errorCount).toBe(1);
    expect(preview.rows.find((r) => r.line === 3)?.errors).toEqual({
      units: ['Only 2 units of lot IMP-FZ-01 are left to deliver'],
    });
  });

  it('takes the file as a text/csv body too', async () => {
    const w = await importWorkshop();
    const res = await request(h.app)
      .post('/api/deliveries/import/preview')
      .set(bearer(w.members.production))
      .set('Content-Type', 'text/csv')
      .send(GOOD);
    expect(res.status).toBe(200);
    expect(res.body.commitable).toBe(true);
  });

  it('answers 400 with a file field when no file is sent, or a UTF-16 one', async () => {
    const w = await importWorkshop();
    const none = await request(h.app)
      .post('/api/deliveries/import/preview')
      .set(bearer(w.members.production));
    expect(none.status).toBe(400);
    expect(none.body.error.fieldErrors.file).toBeDefined();
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(GOOD, 'utf16le')]);
    const res = await request(h.app)
      .post('/api/deliveries/import/preview')
      .set(bearer(w.members.production))
      .attach('file', utf16, 'deliveries.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.file).toBeDefined();
  });

  it('lists a file without the required columns as a file problem', async () => {
    const w = await importWorkshop();
    const preview = deliveryImportPreviewSchema.parse(
      (await upload(w, '/preview', 'customer,units\nLarkspur Pantry,3\n')).body,
    );
    expect(preview.commitable).toBe(false);
    expect(preview.fileErrors).toEqual([
      'The file has no "delivered_on" column',
      'The file has no "lot_code" column',
    ]);
  });
});

describe('POST /api/deliveries/import', () => {
  it('saves every delivery of a good file in file order, each logged as made by an import', async () => {
    const w = await importWorkshop();
    const res = await upload(w, '', GOOD);
    expect(res.status).toBe(201);
    const result = deliveryImportResultSchema.parse(res.body);
    expect(result.imported).toBe(2);
    const saved = await deliveriesOf(w);
    expect(saved.items.map((d) => d.id)).toEqual(result.ids);
    expect(
      saved.items.map((d) => [
        d.customerName,
        d.reference,
        d.lines.map((l) => [l.lotCode, l.units]),
      ]),
    ).toEqual([
      [
        'Larkspur Pantry',
        'INV-2001',
        [
          ['IMP-FZ-01', 24],
          ['IMP-SB-02', 12],
        ],
      ],
      ['Tidewell Market Stall', null, [['IMP-FZ-01', 6]]],
    ]);
    const events = await h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.workshopId, w.id), eq(auditEvents.subjectType, 'delivery')));
    expect(events).toHaveLength(2);
    expect(events.every((e) => (e.detail as { via?: string }).via === 'import')).toBe(true);
  });

  it('a file with one bad row saves nothing and answers 400 with the row’s problem', async () => {
    const w = await importWorkshop();
    const res = await upload(w, '', ONE_BAD_ROW);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('1 row needs attention; nothing was imported.');
    expect(res.body.error.fieldErrors).toEqual({
      'rows.4.lot_code': ['No finished lot with the code "NO-SUCH-LOT" in this workshop'],
    });
    expect((await deliveriesOf(w)).total).toBe(0);
  });

  it('a file that would take a lot past its units made saves nothing', async () => {
    const w = await importWorkshop();
    const csv = [
      'delivered_on,customer,lot_code,units',
      '2026-02-05,Larkspur Pantry,IMP-SB-02,500',
      '2026-02-05,Tidewell Market Stall,IMP-FZ-01,41',
    ].join('\n');
    const res = await upload(w, '', csv);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual({
      'rows.3.units': ['Only 40 units of lot IMP-FZ-01 are left to deliver'],
    });
    expect((await deliveriesOf(w)).total).toBe(0);
  });

  it('an unknown customer is a row problem: customers are added first, never by the import', async () => {
    const w = await importWorkshop();
    const res = await upload(
      w,
      '',
      'delivered_on,customer,lot_code,units\n2026-02-05,Quince Corner,IMP-FZ-01,1\n',
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['rows.2.customer']).toEqual([
      'No customer named "Quince Corner" in this workshop; add it first',
    ]);
  });
});
