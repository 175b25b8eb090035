import { TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, type Route, type Routes } from '@angular/router';
import { vi } from 'vitest';
import formulasRoutes from '../formulas/formulas.routes';
import lotsRoutes from '../lots/lots.routes';
import labelsRoutes from '../labels/labels.routes';
import materialsRoutes from '../materials/materials.routes';
import { openAs } from '../formulas/formulas-testing';
import suppliersRoutes from '../suppliers/suppliers.routes';
import SupplierPage from '../suppliers/supplier-page/supplier-page';
import { unsavedChangesGuard } from './unsaved-changes';
import { chooseOnLeaving, Elsewhere, leave } from './unsaved-changes-testing';

const ROUTES: Routes = [
  { path: 'suppliers', children: suppliersRoutes },
  { path: 'elsewhere', component: Elsewhere },
];

type Page = Awaited<ReturnType<typeof openAs>>;

/** Opens a new supplier as a formulator and types its name. */
async function typeNewSupplier(): Promise<Page> {
  const page = await openAs('formulator', ROUTES, '/suppliers/new', SupplierPage);
  const name = await page.loader.getHarness(
    MatInputHarness.with({ selector: '[formControlName="name"]' }),
  );
  await name.setValue('Alder Chemicals');
  return page;
}

const unload = () => {
  const event = new Event('beforeunload', { cancelable: true });
  window.dispatchEvent(event);
  return event.defaultPrevented;
};

describe('unsaved changes', () => {
  beforeEach(() => localStorage.clear());

  it('leaves a form without changes at once', async () => {
    await openAs('formulator', ROUTES, '/suppliers/new', SupplierPage);
    expect(await leave()).toBe(true);
    expect(TestBed.inject(Router).url).toBe('/elsewhere');
  });

  it('asks before leaving unsaved changes; “Stay” keeps the page and what was typed', async () => {
    const page = await typeNewSupplier();
    const leaving = leave();
    await chooseOnLeaving(page.root, /Stay on this page/);

    expect(await leaving).toBe(false);
    expect(TestBed.inject(Router).url).toBe('/suppliers/new');
    const name = await page.loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName="name"]' }),
    );
    expect(await name.getValue()).toBe('Alder Chemicals');
  });

  it('“Discard changes” leaves without saving', async () => {
    const page = await typeNewSupplier();
    const leaving = leave();
    await chooseOnLeaving(page.root, /Discard changes/);

    expect(await leaving).toBe(true);
    expect(TestBed.inject(Router).url).toBe('/elsewhere');
    page.backend.expectNone((r) => r.method === 'POST');
  });

  it('“Save and leave” saves, then goes where the member was going', async () => {
    const page = await typeNewSupplier();
    const leaving = leave();
    await chooseOnLeaving(page.root, /Save and leave/);

    const post = await vi.waitFor(() =>
      page.backend.expectOne({ method: 'POST', url: '/api/suppliers' }),
    );
    expect(post.request.body.name).toBe('Alder Chemicals');
    post.flush({
      id: '3d1f0a52-2b7e-4c0b-8f2e-9a8b7c6d5e4f',
      createdAt: '2026-11-01T10:00:00.000Z',
      updatedAt: '2026-11-01T10:00:00.000Z',
      name: 'Alder Chemicals',
      contact: null,
      email: null,
      website: null,
      notes: null,
      materialCount: 0,
    });

    expect(await leaving).toBe(true);
    expect(TestBed.inject(Router).url).toBe('/elsewhere');
  });

  it('asks the browser to confirm a reload while changes are unsaved, and only then', async () => {
    const page = await typeNewSupplier();
    expect(unload()).toBe(true);

    const leaving = leave();
    await chooseOnLeaving(page.root, /Discard changes/);
    await leaving;
    expect(unload()).toBe(false);
  });

  it('guards every page with a form: the formula editor and product identity, materials, suppliers, lots and label stocks', () => {
    const guarded = (routes: Routes): string[] =>
      routes.flatMap((r: Route) => [
        ...(r.canDeactivate?.includes(unsavedChangesGuard) ? [r.path ?? ''] : []),
        ...guarded(r.children ?? []),
      ]);

    expect(guarded(formulasRoutes)).toEqual([':id/identity', ':id/versions/:n', ':id']);
    expect(guarded(materialsRoutes)).toEqual(['new', ':id']);
    expect(guarded(suppliersRoutes)).toEqual(['new', ':id']);
    expect(guarded(lotsRoutes)).toEqual(['new', ':id']);
    expect(guarded(labelsRoutes)).toEqual(['stocks/new', 'stocks/:id']);
  });
});
