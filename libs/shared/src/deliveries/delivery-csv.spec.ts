import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { UTF16_REFUSAL, isUtf16 } from '../csv/csv-import';
import { checkDeliveryCsv, readDeliveryCsv, type DeliveryCsvResolver } from './delivery-csv';

// Fictional workshop data: two customers and two finished lots of the workshop.
const CORNER_SHOP = '11111111-1111-4111-8111-111111111111';
const HARBOUR_MARKET = '22222222-2222-4222-8222-222222222222';
const customers = new Map([
  ['corner shop', CORNER_SHOP],
  ['harbour market', HARBOUR_MARKET],
]);
const lots = new Map([
  ['HB-250601-FZ-01', 'lot-fizzer'],
  ['HB-250602-SB-02', 'lot-soap'],
]);
const resolver: DeliveryCsvResolver = {
  customerId: (name) => customers.get(name.trim().replace(/\s+/g, ' ').toLowerCase()) ?? null,
  finishedLotId: (code) => lots.get(code) ?? null,
};
/** Today for every check: 10 June 2025, so the latest day accepted is 11 June. */
const today = '2025-06-10';
const preview = (csv: string) => checkDeliveryCsv(readDeliveryCsv(csv, Papa), resolver, { today });

const HEADER = 'delivered_on,customer,reference,lot_code,units';
const GOOD = [
  '2025-06-02,Corner Shop,INV-101,HB-250601-FZ-01,24',
  '2025-06-02,corner  shop ,INV-101,HB-250602-SB-02,12',
  '2025-06-03,Harbour Market,,HB-250601-FZ-01,6',
];
const MIXED = [
  ...GOOD,
  '2025-06-02,Corner Shop,INV-102,HB-250601-FZ-01,0', // line 5: units 0
  '2025-06-20,Corner Shop,INV-103,HB-250601-FZ-01,5', // line 6: after tomorrow
  '2025-06-03,Harbour Market,,HB 250601,3', // line 7: a space in the lot code
];
const file = (...rows: string[]) => [HEADER, ...rows].join('\r\n');

describe('delivery CSV preview', () => {
  it('lists each row with its problems in the form words, good rows clean', () => {
    const { preview: p, deliveries } = preview(file(...MIXED));
    expect(p.fileErrors).toEqual([]);
    expect(p.rowCount).toBe(6);
    expect(p.validCount).toBe(3);
    expect(p.errorCount).toBe(3);
    const byLine = new Map(p.rows.map((r) => [r.line, r]));
    for (const line of [2, 3, 4])
      expect(byLine.get(line)).toMatchObject({ valid: true, errors: {} });
    expect(byLine.get(5)?.errors).toEqual({ units: ['Units must be at least 1'] });
    expect(byLine.get(6)?.errors).toEqual({
      delivered_on: ['The delivery date cannot be in the future'],
    });
    expect(byLine.get(7)?.errors['lot_code']?.[0]).toMatch(/cannot contain space/);
    // All or nothing: one bad row and nothing is offered for writing.
    expect(p.commitable).toBe(false);
    expect(deliveries).toEqual([]);
  });

  it('accepts tomorrow (a maker east of Greenwich) and refuses the day after', () => {
    const rows = (day: string) => preview(file(`${day},Corner Shop,A,HB-250601-FZ-01,1`));
    expect(rows('2025-06-11').preview.commitable).toBe(true);
    expect(rows('2025-06-12').preview.rows[0]?.errors['delivered_on']).toEqual([
      'The delivery date cannot be in the future',
    ]);
  });

  it('groups rows into deliveries by customer (case and spaces folded), day and reference', () => {
    const { preview: p } = preview(file(...MIXED));
    // Hand-worked: INV-101 (lines 2, 3), Harbour Market with no reference (4, 7), INV-102 (5);
    // line 6's day is refused, so it belongs to no delivery.
    expect(p.deliveryCount).toBe(3);
    expect(p.deliveries).toEqual([
      {
        customer: 'Corner Shop',
        deliveredOn: '2025-06-02',
        reference: 'INV-101',
        lines: [2, 3],
        totalUnits: 36,
      },
      {
        customer: 'Harbour Market',
        deliveredOn: '2025-06-03',
        reference: null,
        lines: [4, 7],
        totalUnits: 9,
      },
      {
        customer: 'Corner Shop',
        deliveredOn: '2025-06-02',
        reference: 'INV-102',
        lines: [5],
        totalUnits: 0,
      },
    ]);
    expect(p.rows.map((r) => r.delivery)).toEqual([0, 0, 1, 2, null, 1]);
  });

  it('offers the deliveries as the delivery contract fields once every row is fine', () => {
    const { preview: p, deliveries } = preview(file(...GOOD));
    expect(p.commitable).toBe(true);
    expect(deliveries).toEqual([
      {
        customerId: CORNER_SHOP,
        deliveredOn: '2025-06-02',
        reference: 'INV-101',
        lines: [
          { lotCode: 'HB-250601-FZ-01', units: 24 },
          { lotCode: 'HB-250602-SB-02', units: 12 },
        ],
        notes: null,
      },
      {
        customerId: HARBOUR_MARKET,
        deliveredOn: '2025-06-03',
        reference: null,
        lines: [{ lotCode: 'HB-250601-FZ-01', units: 6 }],
        notes: null,
      },
    ]);
  });

  it('names a customer or lot code the workshop does not have, and a lot listed twice', () => {
    const { preview: p } = preview(
      file(
        '2025-06-02,Seaside Gifts,INV-9,HB-250601-FZ-01,2',
        '2025-06-02,Corner Shop,INV-9,HB-999999-XX-01,2',
        '2025-06-02,Corner Shop,INV-9,HB-999999-XX-01,3',
      ),
    );
    expect(p.rows[0]?.errors).toEqual({
      customer: ['No customer named "Seaside Gifts" in this workshop; add it first'],
    });
    expect(p.rows[1]?.errors).toEqual({
      lot_code: ['No finished lot with the code "HB-999999-XX-01" in this workshop'],
    });
    expect(p.rows[2]?.errors['lot_code']).toContain(
      'Lot HB-999999-XX-01 is listed twice; put all its units on one line (it is on line 3 too)',
    );
    expect(p.commitable).toBe(false);
  });

  it('refuses the rows that take a lot past the units it has left, counted in file order', () => {
    // 30 units of the fizzer lot are left; the soap lot's units made are not known.
    const counted: DeliveryCsvResolver = {
      ...resolver,
      unitsLeft: (id) => (id === 'lot-fizzer' ? 30 : null),
    };
    const read = readDeliveryCsv(
      file(
        '2025-06-02,Corner Shop,INV-1,HB-250601-FZ-01,24', // 24 of 30: fine, 6 left
        '2025-06-02,Corner Shop,INV-1,HB-250602-SB-02,900', // not counted: fine
        '2025-06-03,Harbour Market,,HB-250601-FZ-01,7', // 7 > 6 left
        '2025-06-04,Harbour Market,,HB-250601-FZ-01,1', // 31 > 30: none left
      ),
      Papa,
    );
    const { preview: p, deliveries } = checkDeliveryCsv(read, counted, { today });
    const byLine = new Map(p.rows.map((r) => [r.line, r.errors]));
    expect(byLine.get(2)).toEqual({});
    expect(byLine.get(3)).toEqual({});
    expect(byLine.get(4)).toEqual({
      units: ['Only 6 units of lot HB-250601-FZ-01 are left to deliver'],
    });
    expect(byLine.get(5)).toEqual({ units: ['Lot HB-250601-FZ-01 has no units left to deliver'] });
    expect(p.errorCount).toBe(2);
    expect(p.commitable).toBe(false);
    expect(deliveries).toEqual([]);
  });

  it('returns the names to look up before checking', () => {
    const read = readDeliveryCsv(file(...GOOD), Papa);
    expect(read.names).toEqual({
      customers: ['Corner Shop', 'Harbour Market'],
      lotCodes: ['HB-250601-FZ-01', 'HB-250602-SB-02'],
    });
  });

  it('reads the headers an invoicing export writes, in any order', () => {
    const csv =
      'Qty,Batch code,Invoice,Customer name,Delivery date\n24,HB-250601-FZ-01,INV-101,Corner Shop,2025-06-02';
    const { preview: p } = preview(csv);
    expect(p.fileErrors).toEqual([]);
    expect(p.rows[0]).toMatchObject({ lotCode: 'HB-250601-FZ-01', units: '24', valid: true });
    expect(p.commitable).toBe(true);
  });

  it('refuses a file without a required column, or with an unknown one', () => {
    const missing = preview(
      [
        'delivered_on,customer,reference,lot_code',
        '2025-06-02,Corner Shop,INV-1,HB-250601-FZ-01',
      ].join('\n'),
    ).preview;
    expect(missing.fileErrors).toEqual(['The file has no "units" column']);
    expect(missing.rows[0]?.errors).toEqual({ units: ['Enter the units delivered'] });
    expect(missing.commitable).toBe(false);
    const unknown = preview(
      `${HEADER},price\n2025-06-02,Corner Shop,INV-1,HB-250601-FZ-01,4,3.50`,
    ).preview;
    expect(unknown.fileErrors[0]).toMatch(/^Unknown column "price"/);
    expect(unknown.validCount).toBe(1);
    expect(unknown.commitable).toBe(false);
  });

  it('refuses a UTF-16 file (byte-order mark) as a whole', () => {
    const text = `${file(...GOOD)}`;
    const bytes = new Uint8Array(2 + text.length * 2);
    bytes.set([0xff, 0xfe]);
    for (let i = 0; i < text.length; i += 1) bytes[2 + i * 2] = text.charCodeAt(i);
    expect(isUtf16(bytes)).toBe(true);
    const decoded = new TextDecoder('utf-8').decode(bytes);
    const read = readDeliveryCsv(decoded, Papa);
    expect(read.fileErrors).toEqual([UTF16_REFUSAL]);
    expect(read.rows).toEqual([]);
    expect(checkDeliveryCsv(read, resolver, { today }).preview.commitable).toBe(false);
  });

  it('drops a UTF-8 byte-order mark and the export formula guard', () => {
    const { preview: p } = preview(
      `\uFEFF${file("2025-06-02,'=Corner Shop,INV-1,HB-250601-FZ-01,4")}`,
    );
    expect(p.fileErrors).toEqual([]);
    expect(p.rows[0]?.customer).toBe('=Corner Shop');
  });

  it('stops reading after 5000 rows and imports nothing', () => {
    const rows = Array.from({ length: 5001 }, () => GOOD[0]!);
    const { preview: p } = preview(file(...rows));
    expect(p.fileErrors).toEqual([
      'The file has more than 5000 rows; import at most 5000 at a time',
    ]);
    expect(p.rowCount).toBe(0);
    expect(p.commitable).toBe(false);
  });

  it('refuses a file with no data rows', () => {
    const { preview: p } = preview(HEADER);
    expect(p.fileErrors).toEqual(['The file has no data rows']);
    expect(p.commitable).toBe(false);
  });
});
