import fc from 'fast-check';
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_BATCH_CODE_PATTERN, errorEnvelopeSchema } from '@batchproof/shared';
import { aBathProfile, aDraft, aFormula } from '../../fixtures/builders/formula-builder';
import { aLot } from '../../fixtures/builders/lot-builder';
import { aSheetLabelStock } from '../../fixtures/builders/label-stock-builder';
import {
  aLabelRun,
  aProductIdentity,
  aWorkshopLabelDetails,
} from '../../fixtures/builders/label-run-builder';
import { aFragrance, aMaterial, aSupplier } from '../../fixtures/builders/material-builder';
import { pdfBytes } from '../../fixtures/builders/document-files';
import { aCustomer, aDelivery } from '../../fixtures/builders/delivery-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { buildFinishedLot, buildReleasedFormula } from '../support/finished-lot-builder';
import { hostileBody } from '../support/hostile-values';
import { buildCustomer, buildDelivery, buildRecallScenario } from '../support/recall-scenario';
import { buildWeighedBatch } from '../support/released-batch-builder';
import { buildLot, buildMaterial, buildSupplier } from '../support/row-builders';
import {
  addMember,
  buildWorkshop,
  uniqueEmail,
  type BuiltWorkshop,
} from '../support/workshop-builder';

// Every POST, PUT and PATCH route gets bodies built from its valid body with hostile values put
// in (NUL, lone surrogates, year 0, numbers beyond any column …) or any hostile value at all, and
// must never answer 5xx. The run counts stay small so the suite stays quick; routes that hash a
// password (bcrypt, cost 12) get fewer.
const RUNS = 30;
const BCRYPT_RUNS = 8;

let h: ApiHarness;
let w: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
});
afterAll(() => h.close());

type Send = (app: Express, path: string, token: string, body: unknown) => request.Test;

const json: (method: 'post' | 'put' | 'patch') => Send = (method) => (app, path, token, body) => {
  const started = request(app)[method](path);
  return started
    .set('Authorization', `Bearer ${token}`)
    .set('Content-Type', 'application/json')
    .send(JSON.stringify(body) ?? 'null');
};

/** The CSV import takes text: a header and rows of cells, some of them hostile. */
const csv: Send = (app, path, token, body) =>
  request(app)
    .post(path)
    .set('Authorization', `Bearer ${token}`)
    .set('Content-Type', 'text/csv')
    .send(toCsv(body));

function toCsv(body: unknown): string {
  if (!body || typeof body !== 'object' || Array.isArray(body)) return String(body);
  const row = body as Record<string, unknown>;
  const cell = (v: unknown) =>
    `"${(typeof v === 'string' ? v : (JSON.stringify(v) ?? '')).replaceAll('"', '""')}"`;
  return `${Object.keys(row).join(',')}\n${Object.values(row).map(cell).join(',')}\n`;
}

/** A document upload: every form field is text; the file is a small PDF. */
const upload: Send = (app, path, token, body) => {
  const req = request(app).post(path).set('Authorization', `Bearer ${token}`);
  const fields = body && typeof body === 'object' ? Object.entries(body) : [['title', body]];
  for (const [name, value] of fields) {
    req.field(
      String(name) || 'x',
      typeof value === 'string' ? value : String(JSON.stringify(value)),
    );
  }
  return req.attach('file', pdfBytes(), 'sds.pdf');
};

interface FuzzCase {
  route: string;
  /** Path, valid body and caller for this route, made once before its runs. */
  prepare: () => Promise<{ path: string; valid: unknown; token?: string }>;
  send: Send;
  runs?: number;
}

const db = () => h.handle.db;
const material = async () => (await buildMaterial(db(), w.id)).id;
const formula = async () => {
  const res = await json('post')(
    h.app,
    '/api/formulas',
    w.members.owner.token,
    aFormula([{ materialId: await material(), grams: 100 }]),
  );
  return res.body.id as string;
};
const released = async () => {
  const id = await formula();
  await json('post')(h.app, `/api/formulas/${id}/versions/1/release`, w.members.owner.token, {});
  return id;
};
/** A released formula the workshop can print: an address, and the formula's identity. */
const printable = async () => {
  await json('put')(
    h.app,
    '/api/workshop/label-details',
    w.members.owner.token,
    aWorkshopLabelDetails(),
  );
  const id = await released();
  await json('put')(
    h.app,
    `/api/formulas/${id}/identity`,
    w.members.owner.token,
    aProductIdentity(),
  );
  return id;
};
const customer = () =>
  buildCustomer(db(), w.id, {
    name: `Fuzz Gifts ${crypto.randomUUID().slice(0, 6)}`,
    email: uniqueEmail('shop'),
    phone: null,
  });
/** A record of each archivable kind, made once per fuzzed route. */
const archivable = {
  materials: material,
  suppliers: async () => (await buildSupplier(db(), w.id)).id,
  customers: async () => (await customer()).id,
  formulas: formula,
  documents: async () => {
    const res = await upload(h.app, '/api/documents', w.members.owner.token, {
      kind: 'sds',
      title: 'SDS',
      issuedOn: '2025-01-01',
      materialId: await material(),
    });
    return res.body.id as string;
  },
  'label-stocks': async () => {
    const res = await json('post')(
      h.app,
      '/api/label-stocks',
      w.members.owner.token,
      aSheetLabelStock(),
    );
    return res.body.id as string;
  },
};
/** A finished lot (a released batch) of 40 units, or a draft batch, straight in the database. */
const finishedLot = async (state: 'draft' | 'released' = 'released') =>
  buildFinishedLot(db(), w.id, {
    ...(await buildReleasedFormula(db(), w.id)),
    batchCode: `FZ${crypto.randomUUID().slice(0, 8).toUpperCase()}`,
    unitsMade: 40,
    state,
  });
/** A batch of one weighed line (100 g from a lot counted in kg), and a second lot to pick. */
const weighedBatch = async (state: 'draft' | 'released') => {
  const m = await buildMaterial(db(), w.id);
  const lot = async () => (await buildLot(db(), w.id, m.id, { unit: 'kg', quantity: 10 })).id;
  const first = await lot();
  const batch = await buildWeighedBatch(db(), w.id, {
    state,
    lines: [
      {
        materialId: m.id,
        materialName: m.tradeName,
        grams: 100,
        picks: [{ lotId: first, grams: 100 }],
      },
    ],
  });
  return {
    id: batch.id,
    picks: [
      { lotId: first, grams: 60 },
      { lotId: await lot(), grams: 40 },
    ],
  };
};
/** A recall of the scenario's citric lot (reaching Harbour and Tideline), opened by the owner. */
const recall = async () => {
  const s = await buildRecallScenario(db(), w.id);
  const res = await json('post')(h.app, '/api/recalls', w.members.owner.token, {
    scope: { kind: 'supplier-lot', supplierLotId: s.citricLot.id },
    reason: 'Citric acid lot failed the supplier purity check',
    severity: 'minor-harm',
  });
  return { id: res.body.id as string, s };
};
const complaintBody = (formulaId: string, batch: { id: string; batchCode: string }) => ({
  formulaId,
  batchId: batch.id,
  finishedLotCode: batch.batchCode,
  receivedOn: '2026-01-20',
  reporterName: 'Ivy Marsh',
  reporterContact: 'ivy@example.test',
  whatHappened: 'Red skin on the arms after a bath',
  bodyArea: 'Arms',
  serious: true,
  status: 'open',
  followUpNotes: null,
  reportedToFdaOn: '2026-01-22',
});
/** The workshop's assessor, added once. */
let assessorMember: Awaited<ReturnType<typeof addMember>> | undefined;
const assessor = async () =>
  (assessorMember ??= await addMember(db(), TEST_JWT_SECRET, w.id, 'assessor'));
/** The id of a released formula's version 1. */
const releasedVersionId = async () => {
  const version = await request(h.app)
    .get(`/api/formulas/${await released()}/versions/1`)
    .set('Authorization', `Bearer ${w.members.owner.token}`);
  return version.body.id as string;
};
/** A released version shared with the assessor: the share's id. */
const sharedVersion = async () => {
  const share = await json('post')(h.app, '/api/assessment-shares', w.members.owner.token, {
    versionId: await releasedVersionId(),
    assessorId: (await assessor()).id,
  });
  return { shareId: share.body.id as string };
};
/** An assessment the assessor started from a fresh share. */
const startedAssessment = async () => {
  const { shareId } = await sharedVersion();
  const res = await json('post')(h.app, '/api/assessments', (await assessor()).token, { shareId });
  return res.body.id as string;
};
const assessmentBody = {
  exposure: {
    presetKey: null,
    dailyAmountGrams: 7.82,
    retentionFactor: 1,
    bodyWeightKg: 60,
    source: 'SCCS Notes of Guidance, body lotion',
  },
  substances: [],
  partB: {
    conclusion: 'Safe as used',
    labelWarnings: '',
    reasoning: 'Margins above 100',
    credentials: 'MSc toxicology',
  },
};
const signUpBody = () => ({
  workshopName: 'Fuzzed Suds',
  name: 'Pat Fuzz',
  email: uniqueEmail('fuzz'),
  password: 'long-enough-password',
});

const cases: FuzzCase[] = [
  {
    route: 'POST /api/auth/sign-up',
    prepare: async () => ({ path: '/api/auth/sign-up', valid: signUpBody() }),
    send: json('post'),
    runs: BCRYPT_RUNS,
  },
  {
    route: 'POST /api/auth/sign-up/confirm',
    prepare: async () => ({ path: '/api/auth/sign-up/confirm', valid: { token: 'x'.repeat(43) } }),
    send: json('post'),
  },
  {
    route: 'POST /api/auth/sign-in',
    prepare: async () => ({
      path: '/api/auth/sign-in',
      valid: { email: w.members.viewer.email, password: 'wrong-password' },
    }),
    send: json('post'),
    runs: BCRYPT_RUNS,
  },
  {
    route: 'POST /api/auth/refresh',
    prepare: async () => ({ path: '/api/auth/refresh', valid: {} }),
    send: json('post'),
  },
  {
    route: 'POST /api/auth/sign-out',
    prepare: async () => ({ path: '/api/auth/sign-out', valid: {} }),
    send: json('post'),
  },
  {
    route: 'POST /api/auth/sign-out-everywhere',
    // A member of its own, since signing out everywhere ends that member's tokens.
    prepare: async () => ({
      path: '/api/auth/sign-out-everywhere',
      valid: {},
      token: (await addMember(db(), TEST_JWT_SECRET, w.id, 'viewer')).token,
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/auth/workshop',
    // Switching into the workshop the owner is already in: a valid body that changes nothing.
    prepare: async () => ({ path: '/api/auth/workshop', valid: { workshopId: w.id } }),
    send: json('post'),
  },
  {
    route: 'POST /api/auth/invitations/accept',
    prepare: async () => ({
      path: '/api/auth/invitations/accept',
      valid: { token: 'x'.repeat(43), name: 'Pat', password: 'long-enough-password' },
    }),
    send: json('post'),
    runs: BCRYPT_RUNS,
  },
  {
    route: 'POST /api/auth/password-reset/request',
    prepare: async () => ({
      path: '/api/auth/password-reset/request',
      valid: { email: w.members.viewer.email },
    }),
    send: json('post'),
    runs: BCRYPT_RUNS,
  },
  {
    route: 'POST /api/auth/password-reset/complete',
    prepare: async () => ({
      path: '/api/auth/password-reset/complete',
      valid: { token: 'x'.repeat(43), password: 'long-enough-password' },
    }),
    send: json('post'),
    runs: BCRYPT_RUNS,
  },
  {
    route: 'POST /api/members/invitations',
    prepare: async () => ({
      path: '/api/members/invitations',
      valid: { email: uniqueEmail('invitee'), role: 'viewer' },
    }),
    send: json('post'),
  },
  {
    route: 'PATCH /api/members/:id',
    prepare: async () => ({
      path: `/api/members/${(await addMember(db(), TEST_JWT_SECRET, w.id, 'viewer')).id}`,
      valid: { role: 'production' },
    }),
    send: json('patch'),
  },
  {
    route: 'POST /api/evaluations',
    prepare: async () => ({
      path: '/api/evaluations',
      valid: {
        asOf: '2026-01-01',
        markets: ['US', 'EU'],
        product: {
          name: 'Fizz',
          use: 'rinse-off',
          contact: { mucousMembranes: true, eyeArea: false, lips: false },
          inBath: true,
          adultsOnly: false,
          ifraCategory: '9',
          netQuantity: { amount: 150, unit: 'g' },
        },
        lines: [
          {
            grams: 100,
            material: { name: 'Bicarb', inci: 'Sodium Bicarbonate', functions: ['buffering'] },
          },
        ],
      },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/suppliers',
    prepare: async () => ({ path: '/api/suppliers', valid: aSupplier() }),
    send: json('post'),
  },
  {
    route: 'PUT /api/suppliers/:id',
    prepare: async () => ({
      path: `/api/suppliers/${(await buildSupplier(db(), w.id)).id}`,
      valid: aSupplier(),
    }),
    send: json('put'),
  },
  {
    route: 'POST /api/materials',
    prepare: async () => ({ path: '/api/materials', valid: aFragrance() }),
    send: json('post'),
  },
  {
    route: 'PUT /api/materials/:id',
    prepare: async () => ({
      path: `/api/materials/${await material()}`,
      valid: aMaterial({
        calibrations: [{ unit: 'cup', amount: 1, grams: 200, measuredOn: '2025-01-01' }],
      }),
    }),
    send: json('put'),
  },
  {
    route: 'POST /api/materials/import/preview',
    prepare: async () => ({
      path: '/api/materials/import/preview',
      valid: { tradeName: 'Salt', inci: 'Sodium Chloride', category: 'base', notes: 'n' },
    }),
    send: csv,
  },
  {
    route: 'POST /api/materials/import',
    prepare: async () => ({
      path: '/api/materials/import',
      valid: { tradeName: 'Salt', inci: 'Sodium Chloride', category: 'base', notes: 'n' },
    }),
    send: csv,
  },
  {
    route: 'POST /api/documents',
    prepare: async () => ({
      path: '/api/documents',
      valid: { kind: 'sds', title: 'SDS', issuedOn: '2025-01-01', materialId: await material() },
    }),
    send: upload,
  },
  {
    route: 'POST /api/lots',
    prepare: async () => ({ path: '/api/lots', valid: aLot(await material()) }),
    send: json('post'),
  },
  {
    route: 'PUT /api/lots/:id',
    prepare: async () => {
      const m = await material();
      return { path: `/api/lots/${(await buildLot(db(), w.id, m)).id}`, valid: aLot(m) };
    },
    send: json('put'),
  },
  {
    route: 'POST /api/formulas',
    prepare: async () => ({
      path: '/api/formulas',
      valid: aFormula([{ materialId: await material(), grams: 100 }]),
    }),
    send: json('post'),
  },
  {
    route: 'PATCH /api/formulas/:id',
    prepare: async () => ({
      path: `/api/formulas/${await formula()}`,
      valid: { name: 'Renamed', productType: 'fizzer', notes: null },
    }),
    send: json('patch'),
  },
  {
    route: 'POST /api/formulas/:id/versions',
    prepare: async () => ({
      path: `/api/formulas/${await released()}/versions`,
      valid: { fromVersion: 1 },
    }),
    send: json('post'),
  },
  {
    route: 'PUT /api/formulas/:id/versions/:n',
    prepare: async () => ({
      path: `/api/formulas/${await formula()}/versions/1`,
      valid: {
        ...aDraft([]),
        lines: undefined,
        byPercent: { batchGrams: 500, lines: [{ materialId: await material(), percent: 100 }] },
      },
    }),
    send: json('put'),
  },
  {
    route: 'PATCH /api/formulas/:id/versions/:n',
    prepare: async () => ({
      path: `/api/formulas/${await formula()}/versions/1`,
      valid: { notes: 'n', profile: aBathProfile() },
    }),
    send: json('patch'),
  },
  {
    route: 'POST /api/formulas/:id/versions/:n/release',
    prepare: async () => ({
      path: `/api/formulas/${await formula()}/versions/1/release`,
      valid: { override: { reason: 'Checked by hand with the assessor' } },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/formulas/:id/versions/:n/scale',
    prepare: async () => ({
      path: `/api/formulas/${await formula()}/versions/1/scale`,
      valid: { units: 12, unitMassGrams: 150, lossPercent: 2 },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/label-stocks',
    prepare: async () => ({ path: '/api/label-stocks', valid: aSheetLabelStock() }),
    send: json('post'),
  },
  {
    route: 'PUT /api/label-stocks/:id',
    prepare: async () => ({
      path: `/api/label-stocks/${await archivable['label-stocks']()}`,
      valid: aSheetLabelStock({ shape: { kind: 'rounded-rectangle', cornerRadiusMm: 3 } }),
    }),
    send: json('put'),
  },
  {
    route: 'PUT /api/workshop/label-details',
    prepare: async () => ({ path: '/api/workshop/label-details', valid: aWorkshopLabelDetails() }),
    send: json('put'),
  },
  {
    route: 'PUT /api/formulas/:id/identity',
    prepare: async () => ({
      path: `/api/formulas/${await formula()}/identity`,
      valid: aProductIdentity({ gtin: '09521234543213' }),
    }),
    send: json('put'),
  },
  {
    route: 'POST /api/label-runs',
    prepare: async () => ({
      path: '/api/label-runs',
      valid: aLabelRun(await printable(), {
        markets: ['US', 'EU'],
        expiresOn: '2027-01-31',
        layout: 'panels',
        placement: { warnings: 'front' },
        overrideReason: 'Fuzzing',
      }),
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/label-runs/:id/withdraw',
    prepare: async () => {
      const run = await json('post')(
        h.app,
        '/api/label-runs',
        w.members.owner.token,
        aLabelRun(await printable()),
      );
      return { path: `/api/label-runs/${run.body.id}/withdraw`, valid: {} };
    },
    send: json('post'),
  },
  {
    route: 'PUT /api/workshop/production',
    prepare: async () => ({
      path: '/api/workshop/production',
      valid: {
        weighingTolerancePercent: 2,
        batchCodePattern: DEFAULT_BATCH_CODE_PATTERN,
        smallBusiness: true,
      },
    }),
    send: json('put'),
  },
  {
    route: 'POST /api/batches',
    prepare: async () => ({
      path: '/api/batches',
      valid: {
        formulaId: await printable(),
        version: 1,
        totalGrams: 1000,
        lossPercent: 2,
        madeOn: '2026-01-15',
      },
    }),
    send: json('post'),
  },
  {
    route: 'PUT /api/batches/:id',
    prepare: async () => {
      const batch = await weighedBatch('draft');
      const check = { result: 'pass', note: 'Even colour' };
      return {
        path: `/api/batches/${batch.id}`,
        valid: {
          lines: [{ lineNumber: 1, usedMaterialId: null, lotPicks: batch.picks, actualGrams: 100 }],
          conditions: { roomTemperatureC: 19.5, humidityPercent: 45 },
          mould: { name: 'Sphere tray', unitsMade: 6 },
          timing: { hoursInMould: 12, curingDays: 2 },
          checks: {
            appearance: check,
            hardness: check,
            fizzOrLather: check,
            unitWeightsGrams: [151.2],
            ph: 7,
          },
          notes: 'Made in the morning',
        },
      };
    },
    send: json('put'),
  },
  {
    route: 'POST /api/batches/:id/release',
    // Takes no body: the first run may release the draft, the rest find it released.
    prepare: async () => ({
      path: `/api/batches/${(await weighedBatch('draft')).id}/release`,
      valid: {},
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/batches/:id/amendments',
    prepare: async () => {
      const batch = await weighedBatch('released');
      return {
        path: `/api/batches/${batch.id}/amendments`,
        valid: {
          field: 'lines.1.lotPicks',
          value: batch.picks,
          reason: 'The scoop came from two tubs',
        },
      };
    },
    send: json('post'),
  },
  {
    route: 'POST /api/lots/:id/adjustments',
    prepare: async () => ({
      path: `/api/lots/${(await buildLot(db(), w.id, await material())).id}/adjustments`,
      valid: { quantity: -0.5, reason: 'spillage', note: 'Knocked off the bench' },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/customers',
    prepare: async () => ({ path: '/api/customers', valid: aCustomer() }),
    send: json('post'),
  },
  {
    route: 'PUT /api/customers/:id',
    prepare: async () => ({ path: `/api/customers/${(await customer()).id}`, valid: aCustomer() }),
    send: json('put'),
  },
  {
    route: 'POST /api/deliveries',
    prepare: async () => ({
      path: '/api/deliveries',
      valid: aDelivery((await customer()).id, [
        { lotCode: (await finishedLot()).batchCode, units: 1 },
      ]),
    }),
    send: json('post'),
  },
  {
    route: 'PUT /api/deliveries/:id',
    prepare: async () => {
      const [c, lot] = [await customer(), await finishedLot()];
      const delivery = await buildDelivery(db(), w.id, c.id, '2026-02-01', [
        { batchId: lot.id, units: 2 },
      ]);
      return {
        path: `/api/deliveries/${delivery.id}`,
        valid: aDelivery(c.id, [{ lotCode: lot.batchCode, units: 3 }]),
      };
    },
    send: json('put'),
  },
  ...(['/import/preview', '/import'] as const).map((tail): FuzzCase => ({
    route: `POST /api/deliveries${tail}`,
    prepare: async () => ({
      path: `/api/deliveries${tail}`,
      valid: {
        delivered_on: '2026-02-05',
        customer: (await customer()).name,
        lot_code: (await finishedLot()).batchCode,
        units: '1',
      },
    }),
    send: csv,
  })),
  {
    route: 'POST /api/recalls/preview',
    prepare: async () => ({
      path: '/api/recalls/preview',
      valid: { scope: { kind: 'finished-lots', finishedLotIds: [(await finishedLot()).id] } },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/recalls',
    prepare: async () => ({
      path: '/api/recalls',
      valid: {
        scope: {
          kind: 'supplier-lot',
          supplierLotId: (await buildRecallScenario(db(), w.id)).citricLot.id,
        },
        reason: 'Citric acid lot failed the supplier purity check',
        severity: 'serious-harm',
        drill: true,
      },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/recalls/:id/notices',
    prepare: async () => ({
      path: `/api/recalls/${(await recall()).id}/notices`,
      valid: { whatToDo: 'Take the fizzers off the shelf' },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/recalls/:id/replies',
    prepare: async () => {
      const { id, s } = await recall();
      return {
        path: `/api/recalls/${id}/replies`,
        valid: {
          customerId: s.harbour.id,
          repliedOn: '2026-03-02',
          unitsOnHand: 4,
          unitsReturned: 3,
          notes: 'Posted back',
        },
      };
    },
    send: json('post'),
  },
  {
    route: 'POST /api/recalls/:id/close',
    // The first accepted run closes it; the rest find it closed.
    prepare: async () => ({
      path: `/api/recalls/${(await recall()).id}/close`,
      valid: { summary: 'Every unit came back or was sold before the notice.' },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/complaints',
    prepare: async () => {
      const lot = await finishedLot();
      return { path: '/api/complaints', valid: complaintBody(lot.formulaId, lot) };
    },
    send: json('post'),
  },
  {
    route: 'PUT /api/complaints/:id',
    prepare: async () => {
      const lot = await finishedLot();
      const valid = complaintBody(lot.formulaId, lot);
      const res = await json('post')(h.app, '/api/complaints', w.members.owner.token, valid);
      return { path: `/api/complaints/${res.body.id}`, valid: { ...valid, status: 'closed' } };
    },
    send: json('put'),
  },
  {
    route: 'POST /api/assessment-shares',
    prepare: async () => ({
      path: '/api/assessment-shares',
      valid: { versionId: await releasedVersionId(), assessorId: (await assessor()).id },
    }),
    send: json('post'),
  },
  {
    route: 'POST /api/assessments',
    // The first accepted run starts it; the rest find the version assessed.
    prepare: async () => ({
      path: '/api/assessments',
      valid: { shareId: (await sharedVersion()).shareId },
      token: (await assessor()).token,
    }),
    send: json('post'),
  },
  {
    route: 'PUT /api/assessments/:id',
    prepare: async () => ({
      path: `/api/assessments/${await startedAssessment()}`,
      valid: assessmentBody,
      token: (await assessor()).token,
    }),
    send: json('put'),
  },
  {
    route: 'POST /api/assessments/:id/sign',
    prepare: async () => {
      const id = await startedAssessment();
      const token = (await assessor()).token;
      await json('put')(h.app, `/api/assessments/${id}`, token, assessmentBody);
      const detail = await request(h.app)
        .get(`/api/assessments/${id}`)
        .set('Authorization', `Bearer ${token}`);
      return {
        path: `/api/assessments/${id}/sign`,
        valid: { contentHash: detail.body.contentHash, confirm: true },
        token,
      };
    },
    send: json('post'),
  },
  {
    route: 'PUT /api/formulas/:id/versions/:n/safety-notes',
    prepare: async () => ({
      path: `/api/formulas/${await released()}/versions/1/safety-notes`,
      valid: {
        physicalChemical: 'White lotion, pH 5.5',
        stability: '12 weeks at 40 °C, no change',
        microbiological: 'Challenge test passed (criteria A)',
        impurities: '',
        packaging: 'HDPE bottle',
        normalUse: 'Apply to the body once a day',
      },
    }),
    send: json('put'),
  },
  {
    route: 'PUT /api/readiness/:formulaId/records/:kind',
    prepare: async () => ({
      path: `/api/readiness/${await released()}/records/ca-notification`,
      valid: {
        reference: 'CNF-88213',
        recordedOn: '2026-11-30',
        firstSaleOn: '2026-11-25',
        smallBusinessExempt: null,
        notes: 'Sent by post',
      },
    }),
    send: json('put'),
  },
  // Archiving takes no body: whatever is sent, the record is archived or brought back.
  ...(
    ['materials', 'suppliers', 'customers', 'formulas', 'documents', 'label-stocks'] as const
  ).flatMap((feature) =>
    (['archive', 'unarchive'] as const).map((action): FuzzCase => ({
      route: `POST /api/${feature}/:id/${action}`,
      prepare: async () => ({
        path: `/api/${feature}/${await archivable[feature]()}/${action}`,
        valid: {},
      }),
      send: json('post'),
    })),
  ),
];

/** Every POST, PUT and PATCH route the app serves, read from its routers. */
function writeRoutes(app: Express): string[] {
  interface Layer {
    rawPath?: string;
    route?: { path: string; methods: Record<string, boolean> };
    handle?: { stack?: Layer[] };
  }
  const found: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = `${prefix}${layer.route.path}`.replace(/(.)\/$/, '$1');
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && ['post', 'put', 'patch'].includes(method)) {
            found.push(`${method.toUpperCase()} ${path}`);
          }
        }
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, prefix + (layer.rawPath === '/' ? '' : (layer.rawPath ?? '')));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return found;
}

describe('hostile bodies on every write route', () => {
  it('covers every POST, PUT and PATCH route the app serves', () => {
    expect(cases.map((c) => c.route).sort()).toEqual(writeRoutes(h.app).sort());
  });

  for (const c of cases) {
    it(`${c.route} never answers 5xx, and every refusal is the error envelope`, async () => {
      const { path, valid, token = w.members.owner.token } = await c.prepare();
      await fc.assert(
        fc.asyncProperty(hostileBody(valid), async (body) => {
          const res = await c.send(h.app, path, token, body);
          expect(res.status, JSON.stringify(body)).toBeLessThan(500);
          if (res.status >= 400) errorEnvelopeSchema.parse(res.body);
        }),
        { numRuns: c.runs ?? RUNS },
      );
    });
  }
});
