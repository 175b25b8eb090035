import { describe, expect, it } from 'vitest';
import { addDays, todayIso } from '../dates/calendar-day';
import { customerCreateSchema } from './customer-schema';
import { MAX_DELIVERY_LINES, deliveryCreateSchema } from './delivery-schema';
import { recallNoticeText } from './recall-notice';
import { recallCreateSchema, recallReplyCreateSchema } from './recall-schema';

const CUSTOMER = '11111111-1111-4111-8111-111111111111';
const messages = (result: { error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  (result.error?.issues ?? []).map((i) => `${i.path.join('.')}: ${i.message}`);

describe('customer contract', () => {
  it('keeps the e-mail in lower case and refuses a phone with letters', () => {
    const ok = customerCreateSchema.parse({
      kind: 'market-stall',
      name: ' Harbour Market ',
      email: 'Stall@Example.COM',
      phone: '+44 (0)1632 960-123',
    });
    expect(ok).toMatchObject({
      name: 'Harbour Market',
      email: 'stall@example.com',
      contact: null,
      address: null,
    });
    expect(
      messages(
        customerCreateSchema.safeParse({ kind: 'stockist', name: 'Corner Shop', phone: 'call me' }),
      ),
    ).toEqual(['phone: Enter a phone number with digits, spaces and + ( ) - . / only']);
    expect(messages(customerCreateSchema.safeParse({ kind: 'shop', name: 'X' }))[0]).toBe(
      'kind: Choose a kind of customer: Stockist, Market stall, Online order, Other',
    );
  });
});

describe('delivery contract', () => {
  const line = { lotCode: 'HB-250601-FZ-01', units: 24 };
  const delivery = {
    customerId: CUSTOMER,
    deliveredOn: todayIso(),
    reference: 'INV-101',
    lines: [line],
  };

  it('takes a delivery of finished lots in whole units', () => {
    expect(
      deliveryCreateSchema.parse({
        ...delivery,
        lines: [{ lotCode: ' HB-250601-FZ-01 ', units: 24 }],
      }),
    ).toEqual({
      ...delivery,
      notes: null,
    });
  });

  it('refuses 0 or part units, a future day, a lot code with a space, and a lot listed twice', () => {
    expect(
      messages(
        deliveryCreateSchema.safeParse({
          ...delivery,
          deliveredOn: addDays(todayIso(), 2),
          lines: [
            { lotCode: 'HB 2506', units: 0 },
            { lotCode: 'HB-1', units: 1.5 },
          ],
        }),
      ),
    ).toEqual([
      'deliveredOn: The delivery date cannot be in the future',
      'lines.0.lotCode: GS1 lot codes cannot contain space. Use letters, digits and ! " % & \' ( ) * + , - . / : ; < = > ? _',
      'lines.0.units: Units must be at least 1',
      'lines.1.units: Enter Units as a whole number',
    ]);
    // Lines are compared once each is valid on its own (zod runs the array's check then).
    expect(
      messages(
        deliveryCreateSchema.safeParse({ ...delivery, lines: [line, { ...line, units: 2 }] }),
      ),
    ).toEqual([
      'lines.1.lotCode: Lot HB-250601-FZ-01 is listed twice; put all its units on one line',
    ]);
  });

  it('caps the lines at MAX_DELIVERY_LINES and asks for at least one', () => {
    const lines = (n: number) =>
      Array.from({ length: n }, (_, i) => ({ lotCode: `HB-${i}`, units: 1 }));
    expect(
      deliveryCreateSchema.safeParse({ ...delivery, lines: lines(MAX_DELIVERY_LINES) }).success,
    ).toBe(true);
    expect(
      messages(
        deliveryCreateSchema.safeParse({ ...delivery, lines: lines(MAX_DELIVERY_LINES + 1) }),
      ),
    ).toEqual(['lines: A delivery has at most 200 lines']);
    expect(messages(deliveryCreateSchema.safeParse({ ...delivery, lines: [] }))).toEqual([
      'lines: List at least one lot delivered',
    ]);
  });
});

describe('recall contract', () => {
  it('opens a recall by supplier lot or by finished lots, not a drill unless asked', () => {
    const opened = recallCreateSchema.parse({
      scope: { kind: 'supplier-lot', supplierLotId: CUSTOMER },
      reason: 'Supplier recalled citric acid lot CA-2291',
      severity: 'minor-harm',
    });
    expect(opened.drill).toBe(false);
    expect(
      messages(
        recallCreateSchema.safeParse({
          scope: { kind: 'finished-lots', finishedLotIds: [CUSTOMER, CUSTOMER] },
          reason: 'x',
          severity: 'class-1',
        }),
      ),
    ).toEqual([
      'scope.finishedLotIds: A finished lot is chosen twice',
      'severity: Choose how serious it is: Could cause serious harm; Could cause minor or temporary harm; Unlikely to cause harm',
    ]);
  });

  it('records a reply in whole units from 0', () => {
    const reply = {
      customerId: CUSTOMER,
      repliedOn: todayIso(),
      unitsOnHand: 0,
      unitsReturned: 12,
    };
    expect(recallReplyCreateSchema.parse(reply)).toMatchObject({
      unitsOnHand: 0,
      unitsReturned: 12,
      notes: null,
    });
    expect(messages(recallReplyCreateSchema.safeParse({ ...reply, unitsReturned: -1 }))).toEqual([
      'unitsReturned: Units returned must be at least 0',
    ]);
  });
});

describe('recall notice', () => {
  const notice = recallNoticeText({
    workshopName: 'Hollowmere Bathworks',
    productName: 'Lavender Fizzer',
    batchCodes: ['HB-250601-FZ-01', 'HB-250602-FZ-02'],
    reason: 'The citric acid in these batches was recalled by its supplier.',
    whatToDo: 'We will collect the units and refund them in full.',
    contact: { person: 'Ada Wren', email: 'recalls@hollowmere.example', phone: '+44 1632 960123' },
    customerName: 'Corner Shop',
  });

  it('names the product and every batch code in the subject and the body', () => {
    expect(notice.subject).toBe(
      'Recall: Lavender Fizzer, batches HB-250601-FZ-01, HB-250602-FZ-02 - stop selling and reply',
    );
    expect(notice.body).toContain(
      'Hollowmere Bathworks is recalling Lavender Fizzer, batches:\n  HB-250601-FZ-01\n  HB-250602-FZ-02\n',
    );
    expect(notice.body).toContain(
      'Why: The citric acid in these batches was recalled by its supplier.',
    );
  });

  it('tells the recipient to stop selling, set the stock aside and reply with the units on hand', () => {
    expect(notice.body).toContain('1. Stop selling these batches and take any units off display.');
    expect(notice.body).toContain('2. Set the stock aside where it will not be sold or used.');
    expect(notice.body).toContain(
      '3. Reply with the number of units of each batch you still have, even if it is none.',
    );
    expect(notice.body).toContain('We will collect the units and refund them in full.');
  });

  it("gives the workshop's contact to reply to", () => {
    expect(notice.body).toContain(
      'Reply to Ada Wren at Hollowmere Bathworks: recalls@hollowmere.example or +44 1632 960123.',
    );
    const bare = recallNoticeText({
      workshopName: 'Hollowmere Bathworks',
      productName: 'Soap',
      batchCodes: ['S-1'],
      reason: 'r',
      contact: {},
    });
    expect(bare.subject).toBe('Recall: Soap, batch S-1 - stop selling and reply');
    expect(bare.body).toContain('Reply to Hollowmere Bathworks.');
    expect(bare.body.startsWith('Hello,\n')).toBe(true);
  });
});
