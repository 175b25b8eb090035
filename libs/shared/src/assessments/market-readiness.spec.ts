import { describe, expect, it } from 'vitest';
import { productIdentitySchema, type ProductIdentity } from '../labels/product-identity';
import {
  canadaNotificationDue,
  marketReadiness,
  type MarketReadinessInput,
} from './market-readiness';
import type { MarketReadiness, MarketRecord, ReadinessItem } from './readiness-api';

const FORMULA = '11111111-1111-4111-8111-111111111111';
const ASSESSMENT = '22222222-2222-4222-8222-222222222222';

const fullIdentity: ProductIdentity = productIdentitySchema.parse({
  productName: 'Everyday Body Lotion',
  productCode: 'EBL-1',
  shelfLifeMonths: 12,
  usAdverseEventContact: { website: 'example.com/safety' },
  euResponsiblePerson: { name: 'Fictional RP GmbH', address: 'Musterweg 1, 10115 Berlin' },
  ukResponsiblePerson: { name: 'Fictional RP Ltd', address: '1 High Street, York YO1 1AA' },
  canadianFrench: { productName: 'Lotion corporelle' },
});

const record = (over: Partial<MarketRecord> & Pick<MarketRecord, 'kind'>): MarketRecord => ({
  reference: null,
  recordedOn: null,
  firstSaleOn: null,
  smallBusinessExempt: null,
  notes: null,
  updatedAt: '2026-12-01T10:00:00.000Z',
  ...over,
});

const base = (over: Partial<MarketReadinessInput> = {}): MarketReadinessInput => ({
  formulaId: FORMULA,
  markets: ['EU', 'UK', 'US', 'CA'],
  releasedVersionNumber: 3,
  signedAssessment: { id: ASSESSMENT, versionNumber: 3 },
  labelRunMarkets: ['EU', 'UK', 'US', 'CA'],
  records: [
    record({ kind: 'eu-notification', reference: 'CPNP-123' }),
    record({ kind: 'uk-notification', reference: 'UKCP-456' }),
    record({ kind: 'us-listing', reference: 'FDA-789' }),
    record({ kind: 'ca-notification', reference: 'CNF-1' }),
  ],
  identity: fullIdentity,
  workshopAddressPresent: true,
  today: '2026-12-03',
  ...over,
});

const market = (result: MarketReadiness[], m: string) => result.find((r) => r.market === m)!;
const itemOf = (result: MarketReadiness[], m: string, key: string): ReadinessItem =>
  market(result, m).items.find((i) => i.key === key)!;

describe('marketReadiness', () => {
  it('is complete in every market when everything is in place, each item with its rule', () => {
    const result = marketReadiness(base());
    expect(result.map((r) => [r.market, r.complete])).toEqual([
      ['EU', true],
      ['UK', true],
      ['US', true],
      ['CA', true],
    ]);
    for (const r of result)
      for (const i of r.items) {
        expect(i.source.length).toBeGreaterThan(10);
        expect(i.detail).toBeNull();
      }
    expect(market(result, 'EU').items.map((i) => i.key)).toEqual([
      'assessment',
      'labels',
      'notification',
      'responsible-person',
    ]);
    expect(market(result, 'US').items.map((i) => i.key)).toEqual([
      'substantiation',
      'labels',
      'listing',
      'adverse-event-contact',
    ]);
    expect(market(result, 'CA').items.map((i) => i.key)).toEqual([
      'labels',
      'notification',
      'name-address',
    ]);
  });

  it('answers only the markets of the released version', () => {
    expect(marketReadiness(base({ markets: ['EU'] })).map((r) => r.market)).toEqual(['EU']);
  });

  describe('EU and UK', () => {
    it('links a signed assessment of the released version (Regulation (EC) No 1223/2009, Art. 10, Annex I)', () => {
      const i = itemOf(marketReadiness(base()), 'EU', 'assessment');
      expect(i).toMatchObject({ done: true, link: `/assessments/${ASSESSMENT}` });
      expect(i.label).toBe('Safety assessment signed for version 3');
      expect(i.source).toMatch(/Art\. 10/);
    });

    it('names the last assessed version when a later one is released, linking the formula to share it', () => {
      const result = marketReadiness(
        base({ signedAssessment: { id: ASSESSMENT, versionNumber: 2 } }),
      );
      for (const m of ['EU', 'UK']) {
        const i = itemOf(result, m, 'assessment');
        expect(i.done).toBe(false);
        expect(i.detail).toMatch(
          /^Version 3 has no signed safety assessment \(version 2 was assessed\)/,
        );
        expect(i.link).toBe(`/formulas/${FORMULA}`);
        expect(market(result, m).complete).toBe(false);
      }
    });

    it('asks for an assessment when none is signed', () => {
      const i = itemOf(marketReadiness(base({ signedAssessment: null })), 'UK', 'assessment');
      expect(i.done).toBe(false);
      expect(i.detail).toMatch(/^Version 3 has no signed safety assessment: share it/);
    });

    it('needs labels printed from the released version for that market', () => {
      const result = marketReadiness(base({ labelRunMarkets: ['US'] }));
      const i = itemOf(result, 'EU', 'labels');
      expect(i).toMatchObject({ done: false, link: '/labels' });
      expect(i.detail).toBe('No labels for EU printed from version 3 yet');
      expect(itemOf(result, 'US', 'labels').done).toBe(true);
    });

    it('needs the notification reference before sale (EU Art. 13(1) CPNP; UK Art. 13 SCPN)', () => {
      const result = marketReadiness(
        base({ records: [record({ kind: 'eu-notification', reference: '  ' })] }),
      );
      const eu = itemOf(result, 'EU', 'notification');
      expect(eu).toMatchObject({ done: false, link: '/readiness' });
      expect(eu.source).toMatch(/Art\. 13\(1\).*CPNP/);
      const uk = itemOf(result, 'UK', 'notification');
      expect(uk.done).toBe(false);
      expect(uk.source).toMatch(/SCPN/);
    });

    it('is complete except for the notification when only the reference is missing (the journey’s end state)', () => {
      const result = marketReadiness(base({ markets: ['EU'], records: [] }));
      expect(market(result, 'EU').complete).toBe(false);
      expect(
        market(result, 'EU')
          .items.filter((i) => !i.done)
          .map((i) => i.key),
      ).toEqual(['notification']);
    });

    it('lists what the responsible person lacks, linking the product identity (Art. 4 and 19(1)(a))', () => {
      const identity = productIdentitySchema.parse({
        ...fullIdentity,
        euResponsiblePerson: { name: 'Fictional RP GmbH', address: null },
      });
      const i = itemOf(marketReadiness(base({ identity })), 'EU', 'responsible-person');
      expect(i.done).toBe(false);
      expect(i.detail).toBe("The EU responsible person's postal address");
      expect(i.link).toBe(`/formulas/${FORMULA}/identity`);
    });

    it('does not count a missing period after opening against the responsible person', () => {
      const identity = productIdentitySchema.parse({ ...fullIdentity, shelfLifeMonths: 36 });
      expect(itemOf(marketReadiness(base({ identity })), 'EU', 'responsible-person').done).toBe(
        true,
      );
    });

    it('says the identity is not entered when there is none', () => {
      const i = itemOf(marketReadiness(base({ identity: null })), 'UK', 'responsible-person');
      expect(i).toMatchObject({ done: false, detail: 'Product identity not entered yet' });
    });
  });

  describe('US (MoCRA)', () => {
    it('takes a signed assessment of the released version as safety substantiation (FD&C Act §608, 21 U.S.C. 364d)', () => {
      const i = itemOf(marketReadiness(base()), 'US', 'substantiation');
      expect(i).toMatchObject({ done: true, link: `/assessments/${ASSESSMENT}` });
      expect(i.source).toMatch(/364d/);
    });

    it('takes a us-substantiation record with a reference instead', () => {
      const result = marketReadiness(
        base({
          signedAssessment: null,
          records: [record({ kind: 'us-substantiation', reference: 'Safety file 2026-07' })],
        }),
      );
      expect(itemOf(result, 'US', 'substantiation')).toMatchObject({
        done: true,
        link: '/readiness',
      });
    });

    it('is missing when the only signed assessment is of an older version and nothing is recorded', () => {
      const result = marketReadiness(
        base({ signedAssessment: { id: ASSESSMENT, versionNumber: 1 }, records: [] }),
      );
      const i = itemOf(result, 'US', 'substantiation');
      expect(i.done).toBe(false);
      expect(i.detail).toMatch(/version 3/);
    });

    it('accepts the small-business answer instead of a listing (FD&C Act §612, 21 U.S.C. 364h)', () => {
      const exempt = marketReadiness(
        base({ records: [record({ kind: 'us-listing', smallBusinessExempt: true })] }),
      );
      expect(itemOf(exempt, 'US', 'listing').done).toBe(true);
      const notExempt = marketReadiness(
        base({ records: [record({ kind: 'us-listing', smallBusinessExempt: false })] }),
      );
      const i = itemOf(notExempt, 'US', 'listing');
      expect(i.done).toBe(false);
      expect(i.detail).toMatch(/^Not exempt as a small business/);
      expect(i.source).toMatch(/364c\(c\).*364h/);
      const unanswered = itemOf(marketReadiness(base({ records: [] })), 'US', 'listing');
      expect(unanswered.detail).toMatch(/or that the business is exempt/);
    });

    it('needs a label contact for adverse-event reports (FD&C Act §609(a))', () => {
      const identity = productIdentitySchema.parse({
        ...fullIdentity,
        usAdverseEventContact: {},
      });
      const i = itemOf(marketReadiness(base({ identity })), 'US', 'adverse-event-contact');
      expect(i.done).toBe(false);
      expect(i.detail).toMatch(/adverse-event reports/);
      expect(i.source).toMatch(/364e/);
    });
  });

  describe('Canada (Cosmetic Regulations, C.R.C., c. 869, s. 30: 10 days after first sale)', () => {
    it('puts the due date 10 days after the first sale, across a month end', () => {
      // s. 30(1) "at the latest 10 days after the manufacturer or importer first sells a cosmetic"
      expect(canadaNotificationDue('2026-12-01')).toBe('2026-12-11');
      expect(canadaNotificationDue('2026-12-28')).toBe('2027-01-07');
      expect(canadaNotificationDue('2028-02-25')).toBe('2028-03-06'); // 2028 is a leap year
    });

    it('says when the notification is due while the clock runs, and on the due day itself', () => {
      const input = (today: string) =>
        base({ today, records: [record({ kind: 'ca-notification', firstSaleOn: '2026-12-01' })] });
      const running = itemOf(marketReadiness(input('2026-12-03')), 'CA', 'notification');
      expect(running.done).toBe(false);
      expect(running.detail).toBe('Due by 2026-12-11: 10 days after the first sale on 2026-12-01');
      const dueDay = itemOf(marketReadiness(input('2026-12-11')), 'CA', 'notification');
      expect(dueDay.detail).toMatch(/^Due by 2026-12-11/);
    });

    it('says it is overdue the day after the due date', () => {
      const result = marketReadiness(
        base({
          today: '2026-12-12',
          records: [record({ kind: 'ca-notification', firstSaleOn: '2026-12-01' })],
        }),
      );
      expect(itemOf(result, 'CA', 'notification').detail).toBe(
        'Overdue: it was due by 2026-12-11, 10 days after the first sale on 2026-12-01',
      );
    });

    it('asks for the reference without a clock when no first sale is recorded', () => {
      const i = itemOf(marketReadiness(base({ records: [] })), 'CA', 'notification');
      expect(i.detail).toMatch(/at the latest 10 days after the first sale in Canada/);
    });

    it('is done once the reference is recorded, even after the due date', () => {
      const result = marketReadiness(
        base({
          today: '2027-03-01',
          records: [
            record({ kind: 'ca-notification', firstSaleOn: '2026-12-01', reference: 'CNF-9' }),
          ],
        }),
      );
      expect(itemOf(result, 'CA', 'notification')).toMatchObject({ done: true, detail: null });
    });

    it('needs the workshop address for the name and address on the label (s. 20)', () => {
      const i = itemOf(
        marketReadiness(base({ workshopAddressPresent: false })),
        'CA',
        'name-address',
      );
      expect(i).toMatchObject({ done: false, link: '/workshop' });
      expect(i.source).toMatch(/s\. 20/);
    });
  });
});
