import { MatButtonHarness } from '@angular/material/button/testing';
import type { ComplianceFinding, FormulaVersion } from '@batchproof/shared';
import {
  aVersion,
  BICARB,
  CITRIC,
  fieldInput,
  nextRequest,
  type OpenedPage,
  openVersionOn,
  textOf,
} from '../formulas-testing';
import FormulaPage from './formula-page';

const ROUTES = [{ path: 'formulas/:id/versions/:n', component: FormulaPage }];
const URL = '/formulas/7d3c1f1e-1c1a-4c8e-9a59-0c7a4f2b9e01/versions/1';

const block = (subject: string): ComplianceFinding => ({
  code: 'COLOURANT_NOT_PERMITTED',
  severity: 'block',
  market: 'US',
  subject,
  message: `${subject} is not permitted in products used in the bath.`,
  source: '21 CFR 73.2725',
  status: 'C',
  lines: [1],
});
const BLOCKS = [block('Ultramarines (CI 77007)'), block('Ferric ferrocyanide (CI 77510)')];

const LINES = [
  { material: BICARB, grams: 200 },
  { material: CITRIC, grams: 100 },
];
/** The draft as the server stored it with two blocking findings. */
const BLOCKED = aVersion(LINES, { counts: { block: 2, warn: 0, info: 0 } });

const clickButton = async (page: OpenedPage, text: RegExp) =>
  (await page.loader.getHarness(MatButtonHarness.with({ text }))).click();

/** Clicks Release, refuses it for the two blocks and answers the re-read with the stored check. */
async function refuseRelease(page: OpenedPage) {
  const clicked = clickButton(page, /^\S*\s*Release$/);
  (await nextRequest(page.backend, (r) => r.url.endsWith('/versions/1/release'))).flush(
    {
      error: {
        code: 'release_blocked',
        message: 'Version 1 has 2 blocking finding(s). Resolve them, or the owner may override.',
        findings: BLOCKS,
      },
    },
    { status: 409, statusText: 'Conflict' },
  );
  await clicked;
  (
    await nextRequest(page.backend, (r) => r.method === 'GET' && r.url.endsWith('/versions/1'))
  ).flush(BLOCKED);
  await page.harness.fixture.whenStable();
}

/** Changes line 2's grams and saves; the server answers with `saved`. */
async function saveWith(page: OpenedPage, grams: string, saved: FormulaVersion) {
  await (await fieldInput(page, 'Grams, line 2')).setValue(grams);
  const clicked = clickButton(page, /Save draft/);
  (await nextRequest(page.backend, (r) => r.method === 'PUT')).flush(saved);
  await clicked;
  await page.harness.fixture.whenStable();
}

describe('FormulaPage: every view of a version reads the latest server answer', () => {
  beforeEach(() => localStorage.clear());

  it('after a save that clears both blocks, drops the refusal and shows the new counts in the versions list', async () => {
    const page = await openVersionOn(ROUTES, FormulaPage, URL, 'owner', BLOCKED, [BICARB, CITRIC]);
    await refuseRelease(page);
    expect(textOf(page, '.refusal')).toContain('Not released.');
    expect(textOf(page, 'bp-version-history')).toMatch(/Blocks\s*2/);

    const fixed = aVersion([LINES[0]!, { material: CITRIC, grams: 90 }], {
      counts: { block: 0, warn: 1, info: 0 },
      updatedAt: '2026-11-01T10:05:00.000Z',
    });
    await saveWith(page, '90', fixed);

    expect(page.el.querySelector('.refusal')).toBeNull();
    expect(textOf(page, '.server-check')).toMatch(/Blocks\s*0/);
    expect(textOf(page, 'bp-version-history')).toMatch(/Blocks\s*0/);
    expect(textOf(page, 'bp-version-history')).toMatch(/Check\s*1/);
    expect(textOf(page, 'bp-version-history')).not.toMatch(/Blocks\s*2/);
  });

  it('after a save that leaves one block, the refusal counts what the server found then', async () => {
    const page = await openVersionOn(ROUTES, FormulaPage, URL, 'owner', BLOCKED, [BICARB, CITRIC]);
    await refuseRelease(page);

    await saveWith(page, '95', aVersion(LINES, { counts: { block: 1, warn: 0, info: 0 } }));

    expect(textOf(page, '.refusal')).toContain('found 1 blocking finding(s)');
    expect(textOf(page, '.refusal')).not.toContain('2 blocking');
    expect(textOf(page, 'bp-version-history')).toMatch(/Blocks\s*1/);
  });
});
