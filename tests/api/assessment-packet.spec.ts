import { createHash, randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  buildSafetyPacket,
  PART_A_HEADINGS,
  PART_B_HEADINGS,
  productIdentitySchema,
  type SafetyPacketLineInput,
} from '@batchproof/shared';
import {
  loadSafetyPacket,
  packetHash,
  renderPacketPdf,
  type AssessmentForPacket,
} from '../../apps/api/src/assessments/packet';
import { DRAFT_MARK } from '../../apps/api/src/assessments/packet-pdf';
import {
  complaints,
  documents,
  materials,
  productIdentities,
  safetyNotes,
} from '../../apps/api/src/db/schema';
import { aDraft } from '../../fixtures/builders/formula-builder';
import { bearer } from '../support/auth-header';
import { buildFinishedLot } from '../support/finished-lot-builder';
import { formulaWorkspaceForFile } from '../support/formula-workspace';
import { readPdf } from '../support/label-pdf-reader';
import { buildSupplier } from '../support/row-builders';

const ws = formulaWorkspaceForFile();

/** Every text run of every page, joined with single spaces. */
const allText = (pages: Awaited<ReturnType<typeof readPdf>>) =>
  pages
    .flatMap((p) => p.texts.map((t) => t.str))
    .join(' ')
    .replace(/\s+/g, ' ');

const NOW = new Date('2026-12-03T08:00:00.000Z');

describe('the safety packet of a formula version', () => {
  let formulaId: string;
  let versionId: string;
  let assessment: AssessmentForPacket;
  const load = (a: AssessmentForPacket = assessment, now = NOW) =>
    loadSafetyPacket(ws.h.handle.db, ws.w.id, a, now);
  const lines = (scentGrams: number) => [
    { materialId: ws.m.bicarb, grams: 200 },
    { materialId: ws.m.citric, grams: 100 },
    { materialId: ws.m.blue, grams: 2 },
    { materialId: ws.m.scent, grams: scentGrams },
  ];

  beforeAll(async () => {
    const db = ws.h.handle.db;
    const formula = await ws.createFormula(lines(3));
    formulaId = formula.id;
    versionId = (await ws.getVersion(formulaId, 1)).id;
    const supplier = await buildSupplier(db, ws.w.id, { name: 'Scent Supply Co' });
    await db
      .update(materials)
      .set({ supplierId: supplier.id })
      .where(and(eq(materials.workshopId, ws.w.id), eq(materials.id, ws.m.scent)));
    const content = Buffer.from('%PDF-1.4 certificate');
    await db.insert(documents).values({
      workshopId: ws.w.id,
      materialId: ws.m.scent,
      kind: 'ifra-certificate',
      title: 'IFRA conformity certificate 51st',
      issuedOn: '2026-03-01',
      filename: 'ifra.pdf',
      mimeType: 'application/pdf',
      sizeBytes: content.length,
      sha256: createHash('sha256').update(content).digest('hex'),
      content,
    });
    await buildFinishedLot(db, ws.w.id, {
      formulaId,
      versionId,
      batchCode: 'PKT001',
      unitsMade: 24,
      madeOn: '2026-11-20',
    });
    assessment = {
      id: randomUUID(),
      versionId,
      status: 'draft',
      assessorName: 'Ada Assessor',
      exposure: {
        presetKey: null,
        dailyAmountGrams: 18.67,
        retentionFactor: 0.01,
        bodyWeightKg: 60,
        source: 'Own estimate for a bath product',
      },
      substances: [
        {
          substanceKey: 'linalool',
          pointOfDepartureMgPerKgDay: 117,
          pointOfDepartureSource: 'Test value',
          dermalAbsorptionPercent: null,
          dermalAbsorptionSource: '',
        },
      ],
      partB: {
        conclusion: 'The product is safe as labelled.',
        labelWarnings: 'Keep out of the eyes.',
        reasoning: 'Margins of safety discussed.',
        credentials: 'BSc Toxicology',
      },
      signedAt: null,
      signedByName: null,
      contentHash: null,
    };
  });

  it('gathers composition, fragrance supplier and certificate, documents, batches and label copy', async () => {
    const packet = await load();
    expect(packet.formula.id).toBe(formulaId);
    expect(packet.version).toMatchObject({ id: versionId, number: 1, state: 'draft' });
    expect(packet.workshop.name).toBeTruthy();
    expect(packet.composition.map((c) => c.inci)).toEqual([
      'Sodium Bicarbonate',
      'Citric Acid',
      'Mica (and) Titanium Dioxide (and) Ultramarines',
      'Parfum',
    ]);
    // 200 g of 305 g = 65.57 %
    expect(packet.composition[0]!.percent).toBeCloseTo((200 / 305) * 100, 9);
    expect(packet.composition[3]!.fragrance).toEqual({
      supplierName: 'Scent Supply Co',
      code: null,
      certificate: { title: 'IFRA conformity certificate 51st', issuedOn: '2026-03-01' },
    });
    // Linalool is 12 % of the fragrance, which is 3 g of 305 g.
    const linalool = packet.substances.find((s) => s.key === 'linalool')!;
    expect(linalool.percent).toBeCloseTo((3 / 305) * 12, 9);
    expect(packet.substances.map((s) => s.key)).toContain('ultramarines');
    expect(
      packet.margins.find((m) => m.substanceKey === 'linalool')!.marginOfSafety,
    ).not.toBeNull();
    // The fragrance has its certificate but no SDS or allergen declaration document; the others no SDS.
    expect(packet.documentsOnFile).toEqual([
      expect.objectContaining({
        kind: 'IFRA certificate',
        title: 'IFRA conformity certificate 51st',
      }),
    ]);
    expect(packet.documentsMissing.filter((d) => d.what === 'Safety data sheet')).toHaveLength(4);
    expect(packet.documentsMissing.map((d) => d.what)).toContain('Allergen declaration');
    expect(packet.batches).toEqual([
      { code: 'PKT001', madeOn: '2026-11-20', unitsMade: 24, status: 'released' },
    ]);
    expect(packet.markets.map((m) => m.market).sort()).toEqual(['CA', 'EU', 'UK', 'US']);
    expect(packet.markets.find((m) => m.market === 'EU')!.declaration).toMatch(/^Ingredients:/);
    expect(packet.notes.stability).toBe('');
    expect(packet.undesirableEffects).toEqual([]);
  });

  it('prints every Part A and Part B heading, the composition rows and the DRAFT mark on a draft', async () => {
    const packet = await load();
    const pages = await readPdf(await renderPacketPdf(packet, { draft: true }));
    const text = allText(pages);
    PART_A_HEADINGS.forEach((heading, i) => expect(text).toContain(`${i + 1}. ${heading}`));
    PART_B_HEADINGS.forEach((heading, i) => expect(text).toContain(`${i + 1}. ${heading}`));
    for (const line of packet.composition) {
      expect(text).toContain(line.materialName);
      expect(text).toContain(line.inci!);
    }
    expect(text).toContain('65.57 %');
    expect(text).toContain('32.79 %');
    expect(text).toContain('Scent Supply Co');
    expect(text).toContain('18.67 g/day');
    expect(text).toContain('The product is safe as labelled.');
    expect(text).toContain(packetHash(packet));
    expect(pages.length).toBeGreaterThan(1);
    for (const page of pages) {
      expect(page.texts.map((t) => t.str).join(' ')).toContain(DRAFT_MARK);
    }
    expect(pages[0]!.fonts.join(' ')).toMatch(/SourceSans3/);
  });

  it('prints a signed packet without the DRAFT mark and with the signature', async () => {
    const unsigned = await load();
    const hash = packetHash(unsigned);
    const packet = await load({
      ...assessment,
      status: 'signed',
      signedAt: new Date('2026-12-03T07:30:00.000Z'),
      signedByName: 'Ada Assessor',
      contentHash: hash,
    });
    expect(packetHash(packet)).toBe(hash);
    const text = allText(await readPdf(await renderPacketPdf(packet, { draft: false })));
    expect(text).not.toContain('DRAFT');
    expect(text).toContain('Signed by Ada Assessor on 2026-12-03 07:30 UTC');
    expect(text).toContain(hash);
  });

  it('keeps its hash when only the time of generation changes', async () => {
    const a = await load(assessment, NOW);
    const b = await load(assessment, new Date('2026-12-03T09:15:00.000Z'));
    expect(packetHash(b)).toBe(packetHash(a));
    expect(packetHash(a)).toMatch(/^[0-9a-f]{64}$/);
  });

  it('changes its hash when the safety notes change', async () => {
    const before = packetHash(await load());
    await ws.h.handle.db.insert(safetyNotes).values({
      workshopId: ws.w.id,
      versionId,
      notes: {
        physicalChemical: 'White sphere, 150 g',
        stability: '',
        microbiological: 'Anhydrous: water activity below 0.6',
        impurities: '',
        packaging: 'Shrink wrap',
        normalUse: 'One per bath',
      },
    });
    const packet = await load();
    expect(packet.notes.microbiological).toBe('Anhydrous: water activity below 0.6');
    expect(packetHash(packet)).not.toBe(before);
  });

  it('changes its hash when a complaint is recorded, and lists it under undesirable effects', async () => {
    const before = packetHash(await load());
    await ws.h.handle.db.insert(complaints).values({
      workshopId: ws.w.id,
      formulaId,
      receivedOn: '2026-11-28',
      whatHappened: 'Itching after the bath',
      bodyArea: 'legs',
      serious: false,
    });
    const packet = await load();
    expect(packet.undesirableEffects).toEqual([
      expect.objectContaining({ whatHappened: 'Itching after the bath', bodyArea: 'legs' }),
    ]);
    expect(packetHash(packet)).not.toBe(before);
    const text = allText(await readPdf(await renderPacketPdf(packet, { draft: true })));
    expect(text).toContain('Itching after the bath');
  });

  it("changes its hash when the version's lines change, and when the assessor's inputs change", async () => {
    const before = packetHash(await load());
    const res = await request(ws.h.app)
      .put(ws.versionUrl(formulaId, 1))
      .set(bearer(ws.w.members.formulator))
      .send(aDraft(lines(4)));
    expect(res.status).toBe(200);
    const changed = await load();
    expect(changed.composition[3]!.percent).toBeCloseTo((4 / 306) * 100, 9);
    expect(packetHash(changed)).not.toBe(before);
    const withPod = await load({
      ...assessment,
      substances: [{ ...assessment.substances[0]!, pointOfDepartureMgPerKgDay: 200 }],
    });
    expect(packetHash(withPod)).not.toBe(packetHash(changed));
    const withExposure = await load({
      ...assessment,
      exposure: { ...assessment.exposure!, retentionFactor: 0.1 },
    });
    expect(packetHash(withExposure)).not.toBe(packetHash(changed));
  });

  it('shows the label identity and its directions, and changes its hash when it is entered', async () => {
    const before = await load();
    expect(before.identity).toBeNull();
    await ws.h.handle.db.insert(productIdentities).values({
      workshopId: ws.w.id,
      formulaId,
      identity: productIdentitySchema.parse({
        productName: 'Quiet Tide Bath Fizzer',
        productCode: 'QT-1',
        gtin: null,
        shelfLifeMonths: 12,
        directions: 'Drop one into a warm bath.',
        euResponsiblePerson: { name: 'Fern Hollow Soaps', address: '1 Mill Lane, Dublin' },
      }),
    });
    const packet = await load();
    expect(packet.identity).toMatchObject({
      productName: 'Quiet Tide Bath Fizzer',
      euResponsiblePerson: 'Fern Hollow Soaps, 1 Mill Lane, Dublin',
    });
    expect(packetHash(packet)).not.toBe(packetHash(before));
    const text = allText(await readPdf(await renderPacketPdf(packet, { draft: true })));
    expect(text).toContain('Drop one into a warm bath.');
    expect(text).toContain('Quiet Tide Bath Fizzer');
  });

  it('answers 404 for a version of another workshop', async () => {
    await expect(
      loadSafetyPacket(ws.h.handle.db, randomUUID(), assessment, NOW),
    ).rejects.toMatchObject({ status: 404 });
  });
});

describe('a long packet', () => {
  const material = (i: number): SafetyPacketLineInput['material'] => ({
    tradeName: `Material ${i}`,
    inci: `Substance ${i}`,
    usName: null,
    cas: null,
    ec: null,
    category: 'base',
    functions: [],
    colourIndex: null,
    nano: false,
    components: [],
    ifraCertificate: null,
    allergenDeclaration: null,
    supplierName: null,
  });
  const words = (prefix: string, n: number) =>
    Array.from({ length: n }, (_, i) => `${prefix}${i}`).join(' ');

  it('runs over pages without losing a heading, a line or the end of a long text', async () => {
    const packet = buildSafetyPacket({
      formula: { id: randomUUID(), name: 'Long Lotion', productType: 'lotion' },
      version: { id: randomUUID(), number: 3, state: 'released', releasedAt: null },
      workshop: { name: 'Test Works', address: null },
      lines: Array.from({ length: 60 }, (_, i) => ({
        position: i + 1,
        grams: i + 1,
        material: material(i),
        certificate: null,
      })),
      evaluation: null,
      identity: null,
      notes: {
        physicalChemical: words('pc', 1300),
        stability: words('st', 1300),
        microbiological: '',
        impurities: '',
        packaging: '',
        normalUse: '',
      },
      complaints: [],
      documentsOnFile: [],
      documentsMissing: [],
      batches: [],
      assessment: {
        id: randomUUID(),
        status: 'draft',
        assessorName: 'Ada Assessor',
        exposure: null,
        substances: [],
        partB: {
          conclusion: words('c', 1300),
          labelWarnings: '',
          reasoning: words('r', 3000),
          credentials: 'BSc',
        },
        signedAt: null,
        signedByName: null,
        contentHash: null,
      },
      generatedAt: NOW.toISOString(),
    });
    const text = allText(await readPdf(await renderPacketPdf(packet, { draft: true })));
    PART_A_HEADINGS.forEach((heading, i) => expect(text).toContain(`${i + 1}. ${heading}`));
    PART_B_HEADINGS.forEach((heading, i) => expect(text).toContain(`${i + 1}. ${heading}`));
    for (const end of ['pc1299', 'st1299', 'c1299', 'r2999', 'Material 59 Substance 59']) {
      expect(text).toContain(end);
    }
  });
});
