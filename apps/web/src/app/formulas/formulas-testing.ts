import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { Type } from '@angular/core';
import type { Routes } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { expect, vi } from 'vitest';
import type { Formula, FormulaVersion, Material, ProductProfile, Role } from '@batchproof/shared';
import { signedInAs } from '../auth/signed-in-as';
import { aMaterial } from '../materials/materials-testing';

export { aMaterial, summaryOf } from '../materials/materials-testing';

/** Test data and page set-up for the formulas specs (imported by specs only). */

const STAMP = '2026-11-01T10:00:00.000Z';
export const FORMULA_ID = '7d3c1f1e-1c1a-4c8e-9a59-0c7a4f2b9e01';

export const BICARB = aMaterial('1b7f0c52-5a43-4d7e-8a51-6f0d2f4a0001', {
  tradeName: 'Bicarb, fine',
  inci: 'Sodium Bicarbonate',
  category: 'base',
});
export const CITRIC = aMaterial('1b7f0c52-5a43-4d7e-8a51-6f0d2f4a0002', {
  tradeName: 'Citric acid',
  inci: 'Citric Acid',
  category: 'acid',
});
/** A mica blend with ultramarines (CI 77007): not for US products used in the bath. */
export const BLUE_BLEND = aMaterial('1b7f0c52-5a43-4d7e-8a51-6f0d2f4a0003', {
  tradeName: 'Lagoon blue mica',
  inci: 'Mica (and) Titanium Dioxide (and) Ultramarines',
  category: 'colourant',
  functions: ['colorant'],
  components: [
    { inci: 'Mica', percent: 60, colourIndex: 'CI 77019', functions: ['colorant'] },
    { inci: 'Titanium Dioxide', percent: 25, colourIndex: 'CI 77891', functions: ['colorant'] },
    { inci: 'Ultramarines', percent: 15, colourIndex: 'CI 77007', functions: ['colorant'] },
  ],
});

/** A bath product sold in the US and the EU. */
export const BATH_PROFILE: ProductProfile = {
  use: 'rinse-off',
  contact: { mucousMembranes: true, eyeArea: false, lips: false },
  inBath: true,
  adultsOnly: false,
  soldAsSoap: false,
  ifraCategory: '9',
  markets: ['US', 'EU'],
  unitMassGrams: 150,
  netQuantity: { amount: 150, unit: 'g' },
};

/** A stored version with the given lines (percentages worked out here). */
export function aVersion(
  lines: { material: Material; grams: number }[],
  fields: Partial<FormulaVersion> = {},
): FormulaVersion {
  const total = lines.reduce((s, l) => s + l.grams, 0);
  return {
    id: `9e0c1d2a-0000-4000-8000-00000000000${fields.number ?? 1}`,
    createdAt: STAMP,
    updatedAt: STAMP,
    formulaId: FORMULA_ID,
    number: 1,
    state: 'draft',
    lines: lines.map((l) => ({
      materialId: l.material.id,
      materialName: l.material.tradeName,
      grams: l.grams,
      percent: total > 0 ? (l.grams / total) * 100 : 0,
      substitutes: [],
    })),
    totalGrams: total,
    profile: BATH_PROFILE,
    notes: null,
    evaluation: null,
    counts: { block: 0, warn: 0, info: 0 },
    evaluationProblems: [],
    evaluatedAt: STAMP,
    releasedAt: null,
    overrideReason: null,
    ...fields,
  };
}

/** A formula whose history holds the given versions. */
export function aFormula(versions: FormulaVersion[]): Formula {
  return {
    id: FORMULA_ID,
    createdAt: STAMP,
    updatedAt: STAMP,
    name: 'Lagoon fizzer',
    productType: 'fizzer',
    notes: null,
    versions: versions.map((v) => ({
      number: v.number,
      state: v.state,
      counts: v.counts,
      releasedAt: v.releasedAt,
      updatedAt: v.updatedAt,
    })),
  };
}

/**
 * Signs in as `role` (the session answers from the testing backend), then opens `url` on the given
 * routes with the app's interceptors, as the real app would.
 */
export async function openAs(role: Role, routes: Routes, url: string, page: Type<unknown>) {
  const backend = await signedInAs(role, routes);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, page);
  return {
    harness,
    backend,
    loader: TestbedHarnessEnvironment.loader(harness.fixture),
    root: TestbedHarnessEnvironment.documentRootLoader(harness.fixture),
    el: harness.routeNativeElement!,
  };
}

/**
 * Waits for the page to send a request matching `match` and returns it. Resource reads start
 * after signals settle (and the picker's search after a short pause in typing), so they are
 * awaited rather than expected at once; a harness cannot wait for them, as a pending read keeps
 * the page from settling.
 */
export async function nextRequest(
  backend: HttpTestingController,
  match: (req: HttpRequest<unknown>) => boolean,
  timeout = 2000,
): Promise<TestRequest> {
  return vi.waitFor(
    () => {
      const [found] = backend.match(match);
      if (!found) throw new Error('The page sent no matching request.');
      return found;
    },
    { timeout },
  );
}

/** A page opened by {@link openAs}. */
export type OpenedPage = Awaited<ReturnType<typeof openAs>>;

/** Answers the one read of the lines' materials, which names every one of them. */
export async function flushMaterials(page: OpenedPage, materials: Material[]) {
  const read = await nextRequest(
    page.backend,
    (r) => r.method === 'GET' && r.url === '/api/materials',
  );
  expect(read.request.params.get('ids')!.split(',').sort()).toEqual(
    materials.map((m) => m.id).sort(),
  );
  read.flush({ items: materials });
}

/** Answers the formula's print runs, which the page lists under Labels (none by default). */
export async function flushLabelRuns(page: OpenedPage, items: unknown[] = []) {
  const read = await nextRequest(
    page.backend,
    (r) => r.url === '/api/label-runs' && r.params.get('formulaId') === FORMULA_ID,
  );
  read.flush({ items });
}

/**
 * Opens `url` (version 1 of the test formula) on `routes` and answers its reads: the formula,
 * the version, then its lines' materials.
 */
export async function openVersionOn(
  routes: Routes,
  page: Type<unknown>,
  url: string,
  role: Role,
  version: FormulaVersion,
  materials: Material[],
): Promise<OpenedPage> {
  const opened = await openAs(role, routes, url, page);
  opened.backend.expectOne(`/api/formulas/${FORMULA_ID}`).flush(aFormula([version]));
  opened.backend.expectOne(`/api/formulas/${FORMULA_ID}/versions/1`).flush(version);
  await flushMaterials(opened, materials);
  await flushLabelRuns(opened);
  await opened.harness.fixture.whenStable();
  return opened;
}

/** The input inside the form field labelled `label`. */
export async function fieldInput(page: OpenedPage, label: string) {
  const el = Array.from(page.el.querySelectorAll('mat-form-field')).find(
    (f) => f.querySelector('mat-label')?.textContent?.trim() === label,
  );
  if (!el) throw new Error(`No field labelled ${label}`);
  const id = el.querySelector('input')!.id;
  return page.loader.getHarness(MatInputHarness.with({ selector: `#${id}` }));
}

/** The text of the first element matching `selector`, with its white space squashed. */
export const textOf = (page: OpenedPage, selector: string) =>
  (page.el.querySelector(selector)?.textContent ?? '').replace(/\s+/g, ' ').trim();
