import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  batchSchema,
  ROLES,
  ROLE_SETS,
  type Batch,
  type BatchLine,
  type Role,
} from '@batchproof/shared';
import { gramsAtStep, renderWeighSheetPdf } from '../../apps/api/src/batches/weigh-sheet-pdf';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { readPdf } from '../support/label-pdf-reader';
import { buildLot, buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildWeighedBatch } from '../support/released-batch-builder';

const pick = (supplierLotNumber: string, grams: number, expiresOn: string | null) => ({
  lotId: '1c6e7d2f-4a54-4b5f-8b9f-7a2d3e4c5b61',
  supplierLotNumber,
  expiresOn,
  grams,
  quantity: grams / 1000,
  unit: 'kg' as const,
});

const line = (
  lineNumber: number,
  materialName: string,
  weighGrams: number,
  stepGrams: 0.01 | 0.1 | 1,
  extra: Partial<BatchLine> = {},
): BatchLine => ({
  lineNumber,
  materialId: `m-${lineNumber}`,
  materialName,
  percent: 0,
  grams: weighGrams,
  weighGrams,
  stepGrams,
  substitutes: [],
  suggestedPicks: { status: 'none', picks: [], shortGrams: weighGrams, split: null, notes: [] },
  usedMaterialId: `m-${lineNumber}`,
  usedMaterialName: materialName,
  lotPicks: [],
  actualGrams: null,
  weighing: { status: 'not-weighed', deviationPercent: null, message: null },
  ...extra,
});

/** A hand-built draft batch of 24 fizzers at 180 g with a 3 % loss allowance (4449.6 g). */
export function aDraftBatch(overrides: Partial<Batch> = {}): Batch {
  return batchSchema.parse({
    id: '0b5d6c1e-3f43-4f4e-9a8e-6f1c2d3b4a50',
    createdAt: '2026-12-02T09:00:00.000Z',
    updatedAt: '2026-12-02T09:00:00.000Z',
    formulaId: '2d7f8e3a-5b65-4c6a-9cab-8b3e4f5d6c72',
    formulaName: 'Tidepool Fizzer',
    version: 3,
    batchCode: '261202-TPF-004',
    state: 'draft',
    madeOn: '2026-12-02',
    size: { units: 24, unitMassGrams: 180, targetGrams: 4320, lossPercent: 3, batchGrams: 4449.6 },
    sum: { batchGrams: 4449.6, roundedGrams: 4449.6, differenceGrams: 0, withinRounding: true },
    weighSheetNotes: [],
    tolerancePercent: 1.5,
    lines: [
      line(1, 'Bicarbonate of soda', 2669, 1, {
        suggestedPicks: {
          status: 'single',
          picks: [pick('BIC-2207', 2669, '2027-05-31')],
          shortGrams: 0,
          split: null,
          notes: [],
        },
      }),
      line(2, 'Citric acid', 1334.9, 0.1, {
        suggestedPicks: {
          status: 'short',
          picks: [pick('CIT-0415', 1000, null)],
          shortGrams: 334.9,
          split: null,
          notes: [],
        },
      }),
      line(3, 'Corn starch', 436.3, 0.1, {
        substitutes: [{ materialId: 'm-9', materialName: 'Tapioca starch' }],
      }),
      line(4, 'Lavender oil', 9.43, 0.01),
    ],
    conditions: { roomTemperatureC: null, humidityPercent: null },
    mould: { name: null, unitsMade: null },
    timing: { hoursInMould: null, curingDays: null, readyOn: null },
    checks: {
      appearance: { result: 'not-checked', note: null },
      hardness: { result: 'not-checked', note: null },
      fizzOrLather: { result: 'not-checked', note: null },
      unitWeightsGrams: [],
      unitWeight: null,
      ph: null,
    },
    notes: null,
    durability: { bestBeforeMonth: null, expiresOn: null, periodAfterOpeningMonths: null },
    releasedAt: null,
    releasedBy: null,
    amendments: [],
    ...overrides,
  });
}

const allText = (pages: Awaited<ReturnType<typeof readPdf>>) =>
  pages
    .flatMap((p) => p.texts.map((t) => t.str))
    .join(' ')
    .replace(/\s+/g, ' ');

describe('gramsAtStep', () => {
  it('shows as many decimals as the scale step: 0.01 g → 2, 0.1 g → 1, 1 g → none', () => {
    expect(gramsAtStep(9.43, 0.01)).toBe('9.43');
    expect(gramsAtStep(436.3, 0.1)).toBe('436.3');
    expect(gramsAtStep(2669, 1)).toBe('2669');
    expect(gramsAtStep(200, 0.1)).toBe('200.0');
  });
});

describe('renderWeighSheetPdf', () => {
  let text: string;
  let pages: Awaited<ReturnType<typeof readPdf>>;
  // The first PDF starts the worker thread, which takes a while on a busy machine.
  beforeAll(async () => {
    pages = await readPdf(await renderWeighSheetPdf(aDraftBatch(), 'Hollowmere Test Works'));
    text = allText(pages);
  }, 120_000);

  it('prints the workshop, product, version, batch code, day, size and tolerance', async () => {
    expect(text).toContain('Weigh sheet 261202-TPF-004');
    expect(text).toContain('Hollowmere Test Works');
    expect(text).toContain('Tidepool Fizzer, version 3');
    expect(text).toContain('2026-12-02');
    expect(text).toContain('24 units × 180 g + 3 % loss allowance = 4449.6 g');
    expect(text).toContain('± 1.5 % of each target');
    expect(pages[0]!.fonts.every((f) => f.includes('SourceSans3'))).toBe(true);
  });

  it("prints each line's target at its scale step, substitutes, suggested lots, and the total", async () => {
    for (const grams of ['2669', '1334.9', '436.3', '9.43', '4449.6'])
      expect(text).toContain(grams);
    expect(text).toContain('Tapioca starch');
    expect(text).toContain('BIC-2207: 2669 g (use by 2027-05-31)');
    expect(text).toContain('CIT-0415: 1000.0 g');
    expect(text).toContain('Short by 334.9 g');
    expect(text).toContain('No lot in stock');
    for (const heading of ['Actual (g)', 'Lot used', 'Initials', 'Substitutes allowed'])
      expect(text).toContain(heading);
  });

  it('has the conditions, the checks with boxes to tick, and the signature lines', async () => {
    for (const words of [
      'Room temperature (°C)',
      'Humidity (%)',
      'Units made',
      'Fizz or lather test',
      'Not checked',
      'pH (where measured)',
      'Weighed by',
      'Checked by',
      'Released by',
    ])
      expect(text).toContain(words);
    // 4 checks × 3 boxes of 9 pt (3.2 mm), stroked.
    const boxes = pages
      .flatMap((p) => p.shapes)
      .filter(
        (s) => s.stroked && Math.abs(s.widthMm - 3.175) < 0.1 && Math.abs(s.heightMm - 3.175) < 0.1,
      );
    expect(boxes).toHaveLength(12);
  });

  it('a 60-line batch runs onto a second page and every line is printed', async () => {
    const lines = Array.from({ length: 60 }, (_, i) =>
      line(i + 1, `Material ${i + 1}`, 10 + i, 0.01),
    );
    const long = await readPdf(
      await renderWeighSheetPdf(aDraftBatch({ lines }), 'Hollowmere Test Works'),
    );
    expect(long.length).toBeGreaterThan(1);
    const longText = allText(long);
    expect(longText).toContain('Material 60');
    expect(longText).toContain('69.00');
  });
});

describe('GET /api/batches/:id/weigh-sheet.pdf', () => {
  let h: ApiHarness;
  let w: BuiltWorkshop;
  let other: BuiltWorkshop;
  let batch: { id: string; batchCode: string };
  beforeAll(async () => {
    h = await startApiHarness();
    w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { name: 'Fernhollow Soapery' });
    other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const citric = await buildMaterial(h.handle.db, w.id, aMaterial({ tradeName: 'Citric acid' }));
    const lot = await buildLot(h.handle.db, w.id, citric.id, { quantity: 1, unit: 'kg' });
    batch = await buildWeighedBatch(h.handle.db, w.id, {
      state: 'draft',
      lines: [
        {
          materialId: citric.id,
          materialName: 'Citric acid',
          grams: 312.4,
          picks: [{ lotId: lot.id, grams: 312.4 }],
        },
      ],
    });
  });
  afterAll(() => h.close());
  const sheet = (who?: { token: string }) => {
    const req = request(h.app).get(`/api/batches/${batch.id}/weigh-sheet.pdf`);
    return who ? req.set(bearer(who)) : req;
  };

  it("answers the PDF inline, with the workshop, the batch code and each line's grams", async () => {
    const res = await sheet(w.members.production)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toContain(
      `inline; filename="Weigh sheet ${batch.batchCode}.pdf"`,
    );
    const text = allText(await readPdf(res.body as Buffer));
    expect(text).toContain('Fernhollow Soapery');
    expect(text).toContain(batch.batchCode);
    expect(text).toContain('Citric acid');
    expect(text).toContain('312.4');
  }, 120_000);

  it.each(ROLES.map((r) => [r]))(
    'as %s',
    async (role: Role) => {
      const res = await sheet(w.members[role]);
      expect(res.status).toBe((ROLE_SETS.members as readonly Role[]).includes(role) ? 200 : 403);
    },
    60_000,
  );

  it("another workshop's batch is 404; anonymous is 401", async () => {
    expect((await sheet(other.members.owner)).status).toBe(404);
    expect((await sheet()).status).toBe(401);
  });
});
