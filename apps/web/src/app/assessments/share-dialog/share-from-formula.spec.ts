import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import type { Role } from '@batchproof/shared';
import FormulaPage from '../../formulas/formula-editor/formula-page';
import {
  aVersion,
  BICARB,
  CITRIC,
  FORMULA_ID,
  nextRequest,
  openVersionOn,
} from '../../formulas/formulas-testing';

const ROUTES = [{ path: 'formulas/:id/versions/:n', component: FormulaPage }];
const URL = `/formulas/${FORMULA_ID}/versions/1`;
const RELEASED = aVersion(
  [
    { material: BICARB, grams: 200 },
    { material: CITRIC, grams: 100 },
  ],
  { state: 'released', releasedAt: '2026-12-02T10:00:00.000Z' },
);

const open = (role: Role, version = RELEASED) =>
  openVersionOn(ROUTES, FormulaPage, URL, role, version, [BICARB, CITRIC]);

const buttonTexts = async (page: Awaited<ReturnType<typeof open>>) =>
  Promise.all((await page.loader.getAllHarnesses(MatButtonHarness)).map((b) => b.getText()));

describe('Sharing from the formula version page', { timeout: 20_000 }, () => {
  it('offers the owner "Share with assessor…" on a released version, opening the share dialog', async () => {
    const page = await open('owner');
    expect(await buttonTexts(page)).toContain('health_and_safety Safety notes');
    await (
      await page.loader.getHarness(MatButtonHarness.with({ text: /Share with assessor…/ }))
    ).click();
    (await nextRequest(page.backend, (r) => r.url === '/api/members')).flush({ items: [] });
    const dialog = await vi.waitFor(() => page.root.getHarness(MatDialogHarness));
    expect(await dialog.getTitleText()).toBe('Share with an assessor');
    expect(await dialog.getContentText()).toContain('Lagoon fizzer, version 1');
  });

  it('offers a formulator the safety notes but no sharing', async () => {
    const formulator = await open('formulator');
    const texts = await buttonTexts(formulator);
    expect(texts).toContain('health_and_safety Safety notes');
    expect(texts.some((t) => t.includes('Share with assessor'))).toBe(false);
    expect(
      formulator.el.querySelector('a[href$="/assessments/notes/' + FORMULA_ID + '/1"]'),
    ).not.toBeNull();
  });

  it('offers no sharing on a draft, even to the owner', async () => {
    const page = await open('owner', { ...RELEASED, state: 'draft', releasedAt: null });
    expect((await buttonTexts(page)).some((t) => t.includes('Share with assessor'))).toBe(false);
  });
});
