import { TestBed } from '@angular/core/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { Router, type Routes } from '@angular/router';
import formulasRoutes from '../formulas.routes';
import {
  aVersion,
  BICARB,
  CITRIC,
  fieldInput,
  FORMULA_ID,
  nextRequest,
  openVersionOn,
} from '../formulas-testing';
import { chooseOnLeaving, Elsewhere, leave } from '../../forms/unsaved-changes-testing';
import FormulaPage from './formula-page';

const ROUTES: Routes = [
  { path: 'formulas', children: formulasRoutes },
  { path: 'elsewhere', component: Elsewhere },
];
const URL = `/formulas/${FORMULA_ID}/versions/1`;
const DRAFT = aVersion([
  { material: BICARB, grams: 200 },
  { material: CITRIC, grams: 100 },
]);

const open = () => openVersionOn(ROUTES, FormulaPage, URL, 'formulator', DRAFT, [BICARB, CITRIC]);

describe('FormulaPage: leaving with unsaved edits', () => {
  beforeEach(() => localStorage.clear());

  it('“Save and leave” saves the draft, then leaves', async () => {
    const page = await open();
    await (await fieldInput(page, 'Grams, line 2')).setValue('120');

    const leaving = leave();
    await chooseOnLeaving(page.root, /Save and leave/);
    const put = await nextRequest(page.backend, (r) => r.method === 'PUT');
    expect(put.request.body.lines[1]).toEqual({ materialId: CITRIC.id, grams: 120 });
    put.flush({ ...DRAFT, updatedAt: '2026-11-01T10:05:00.000Z' });

    expect(await leaving).toBe(true);
    expect(TestBed.inject(Router).url).toBe('/elsewhere');
  });

  it('stays, with the reason beside the field, when the draft cannot be saved', async () => {
    const page = await open();
    await (await fieldInput(page, 'Grams, line 2')).setValue('-5');

    const leaving = leave();
    await chooseOnLeaving(page.root, /Save and leave/);

    expect(await leaving).toBe(false);
    expect(TestBed.inject(Router).url).toBe(URL);
    page.backend.expectNone((r) => r.method === 'PUT');
    const grams = await page.loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: 'Grams, line 2' }),
    );
    expect(await grams.getTextErrors()).toEqual(['Grams cannot be negative']);
  });
});
