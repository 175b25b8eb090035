import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readPdf } from '../support/label-pdf-reader';
import {
  DEMO_PASSWORD,
  DEMO_WORKSHOP,
  openFromNav,
  SECOND_WORKSHOP,
  signIn,
  switchWorkshop,
  workshopSwitch,
} from './demo-steps';
import { type JourneyHarness, OUTPUT_DIR, startJourneyHarness } from './journey-harness';

const OWNER = 'owner@hollowmere.example';
const ASSESSOR = 'assessor@hollowmere.example';
const ASSESSOR_NAME = 'Dr. Orla Finchley';
const LOTION = 'Everyday Body Lotion';

/**
 * The assessor's entries for a few substances of the lotion: invented for the journey, NOT
 * published figures (the demo's own assessment says the same of its values).
 */
const POINTS_OF_DEPARTURE = [
  { inci: 'Phenoxyethanol', pod: '350', source: 'Supplier toxicological summary (journey)' },
  { inci: 'Glycerin', pod: '1000', source: 'Assessor’s literature file (journey)' },
  { inci: 'Benzyl Salicylate', pod: '50', source: 'Fragrance supplier’s data pack (journey)' },
];

/** The row of the lotion's version `n` in the Assessments table. */
function assessmentRow(page: Page, n: number) {
  return page
    .getByRole('table', { name: 'Assessments' })
    .getByRole('row')
    .filter({ hasText: LOTION })
    .filter({ has: page.getByRole('cell', { name: String(n), exact: true }) });
}

describe('journey: a safety assessment from share to signature, and the market readiness it completes', () => {
  let h: JourneyHarness;

  beforeAll(async () => {
    h = await startJourneyHarness();
    await h.seedDemo(DEMO_PASSWORD);
  });

  afterAll(async () => {
    await h?.close();
  });

  it('the owner shares version 2 of the lotion, the assessor of two workshops switches, enters points of departure and signs, and the owner downloads the signed packet and sees EU readiness complete but for the notification', async () => {
    // The owner opens the lotion: version 2 is released and its assessment is missing.
    const owner = await h.newPage();
    await signIn(h, owner, OWNER);
    await openFromNav(owner, 'Formulas');
    await owner.getByRole('link', { name: LOTION }).click();
    await owner.getByText('Version 2 · released').waitFor();
    const finding = owner.getByRole('region', { name: 'Safety assessment' });
    await finding
      .getByText(/Version 2 has no signed safety assessment; version 1 was assessed/)
      .first()
      .waitFor()
      .catch(async (error: unknown) => {
        // Say what the page showed instead, so a failure here can be read from the log alone.
        const live = await owner
          .locator('aside.consequences')
          .innerText()
          .catch(() => '(none)');
        throw new Error(`${String(error)}\nThe live checks panel showed:\n${live}`);
      });
    await h.screenshot(owner, 'safety-01-formula-assessment-missing');

    // …and shares it with the demo assessor.
    await owner.getByRole('button', { name: 'Share with assessor…' }).click();
    const share = owner.getByRole('dialog', { name: 'Share with an assessor' });
    await share.getByRole('radio', { name: new RegExp(ASSESSOR_NAME) }).check();
    await h.screenshot(owner, 'safety-02-share-dialog');
    await share.getByRole('button', { name: 'Share' }).click();
    await owner.getByText(`Version 2 is shared with ${ASSESSOR_NAME}.`).waitFor();
    expect(await share.count()).toBe(0);

    // The assessor is told by e-mail.
    const mail = await h.mail.waitFor(ASSESSOR);
    expect(mail.subject).toBe(`${DEMO_WORKSHOP} shared ${LOTION} (version 2) for assessment`);
    expect(mail.text).toContain(`${h.baseUrl}/assessments`);

    // The assessor signs in where they worked last: the other workshop, which knows no lotion.
    const assessor = await h.newPage();
    expect(await signIn(h, assessor, ASSESSOR, null)).toBe(SECOND_WORKSHOP);
    expect(await workshopSwitch(assessor).getAttribute('aria-label')).toBe(
      `Switch workshop: ${SECOND_WORKSHOP}`,
    );
    await openFromNav(assessor, 'Assessments');
    const waiting = assessor.getByRole('list', {
      name: 'Shared versions waiting for an assessment',
    });
    await waiting.getByText('Driftwood Salt Soak').waitFor();
    await assessor
      .getByRole('table', { name: 'Assessments' })
      .getByText('Low Tide Body Butter')
      .waitFor();
    expect(await assessor.getByRole('main').getByText(LOTION).count()).toBe(0);
    await h.screenshot(assessor, 'safety-03-assessor-other-workshop');

    // In the lotion's workshop (switching opens its home page) the version waits; starting accepts it.
    await switchWorkshop(assessor, DEMO_WORKSHOP);
    await openFromNav(assessor, 'Assessments');
    const start = assessor.getByRole('button', {
      name: `Start assessment of ${LOTION} version 2`,
    });
    await start.waitFor();
    // Version 1's signed assessment is listed too; nothing of the other workshop is.
    await assessmentRow(assessor, 1).waitFor();
    expect(await assessor.getByRole('main').getByText('Driftwood Salt Soak').count()).toBe(0);
    await h.screenshot(assessor, 'safety-04-assessor-waiting');
    await start.click();
    await assessor.getByRole('heading', { name: `${LOTION} · version 2`, level: 1 }).waitFor();
    expect(await assessor.getByTestId('assessment-state').textContent()).toContain('Draft');

    // Exposure: the body lotion row of the shipped defaults, offered first for a lotion.
    await assessor.getByRole('combobox', { name: 'Exposure to the product' }).click();
    await assessor
      .getByRole('group', { name: 'For this product type' })
      .getByRole('option', { name: 'Body lotion (leave-on)' })
      .click();
    expect(await assessor.getByTestId('preset').textContent()).toMatch(/SCCS/);
    expect(await assessor.getByTestId('exposure-a').textContent()).toMatch(/A = \d/);

    // Points of departure with their sources: each margin of safety appears as it is typed.
    const toxicology = assessor.getByRole('table', {
      name: 'Toxicological profile of the substances',
    });
    for (const s of POINTS_OF_DEPARTURE) {
      const row = toxicology.getByRole('row').filter({
        has: assessor.getByRole('rowheader', { name: s.inci, exact: true }),
      });
      await row.getByLabel(`Point of departure, ${s.inci}`, { exact: true }).fill(s.pod);
      await row.getByLabel(`Point of departure source, ${s.inci}`, { exact: true }).fill(s.source);
      expect(await row.getByRole('cell').last().textContent()).toMatch(/\d/);
    }

    // Part B.
    await assessor
      .getByRole('textbox', { name: 'Assessment conclusion' })
      .fill(
        'JOURNEY TEXT. Version 2 is safe for human health when used as directed, on the data in this packet.',
      );
    await assessor
      .getByRole('textbox', { name: 'Labelled warnings and instructions of use' })
      .fill('JOURNEY TEXT. For external use only. Avoid contact with eyes.');
    await assessor
      .getByRole('textbox', { name: 'Reasoning' })
      .fill('JOURNEY TEXT. Less fragrance than version 1; margins above 100 where entered.');
    await assessor
      .getByRole('textbox', { name: "Assessor's credentials and approval of part B" })
      .fill('JOURNEY TEXT. A fictional assessor for the journey.');
    await assessor.getByRole('button', { name: 'Save', exact: true }).click();
    await assessor.getByText('The assessment is saved.').waitFor();
    await h.screenshot(assessor, 'safety-05-assessment-entered');

    // Signing shows the packet's hash and asks for a confirmation.
    await assessor.getByRole('button', { name: 'Sign…' }).click();
    const sign = assessor.getByRole('dialog', { name: 'Sign the safety assessment?' });
    await sign.getByText(ASSESSOR_NAME).waitFor();
    const hash = ((await sign.getByTestId('sign-hash').textContent()) ?? '').trim();
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
    const signButton = sign.getByRole('button', { name: 'Sign', exact: true });
    expect(await signButton.isDisabled()).toBe(true);
    await sign.getByRole('checkbox', { name: 'I sign as the qualified safety assessor' }).check();
    await h.screenshot(assessor, 'safety-06-sign-dialog');
    await signButton.click();
    const signedNote = assessor.getByTestId('signed-note');
    await signedNote.waitFor();
    expect(await signedNote.textContent()).toContain(`Signed by ${ASSESSOR_NAME}`);
    expect(await signedNote.locator('code').textContent()).toBe(hash);
    // Locked: nothing left to save or sign.
    expect(await assessor.getByRole('button', { name: 'Sign…' }).count()).toBe(0);
    expect(await assessor.getByRole('textbox', { name: 'Assessment conclusion' }).count()).toBe(0);
    await h.screenshot(assessor, 'safety-07-signed');

    // The assessor goes back to the other workshop, as the demo left them.
    await switchWorkshop(assessor, SECOND_WORKSHOP);

    // The owner opens the signed assessment and downloads its packet.
    await openFromNav(owner, 'Assessments');
    await assessmentRow(owner, 2).getByRole('link', { name: LOTION }).click();
    await owner.getByRole('heading', { name: `${LOTION} · version 2`, level: 1 }).waitFor();
    await owner.getByTestId('signed-note').getByText(hash).waitFor();
    await h.screenshot(owner, 'safety-08-owner-signed-assessment');
    const download = owner.waitForEvent('download');
    await owner.getByRole('button', { name: 'Packet PDF' }).click();
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/-v2-signed\.pdf$/);
    mkdirSync(OUTPUT_DIR, { recursive: true });
    const saved = path.join(OUTPUT_DIR, 'safety-packet-lotion-v2-signed.pdf');
    await file.saveAs(saved);
    const pdf = readFileSync(saved);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const text = (await readPdf(pdf))
      .flatMap((p) => p.texts.map((t) => t.str))
      .join(' ')
      .replace(/\s+/g, ' ');
    expect(text).toContain('Assessment conclusion');
    expect(text).toContain(LOTION);
    expect(text).toContain(ASSESSOR_NAME);
    expect(text).not.toContain('NOT SIGNED');

    // Readiness: the lotion's EU market lacks only the notification reference now.
    await openFromNav(owner, 'Readiness');
    const lotion = owner.getByRole('region', { name: LOTION });
    const eu = lotion.getByRole('article', { name: 'European Union' });
    await eu.waitFor();
    await eu.getByText('Incomplete: 1 missing').waitFor();
    const items = eu.getByRole('list', { name: 'What European Union needs' }).getByRole('listitem');
    const states = await items.evaluateAll((lis) =>
      lis.map((li) => ({
        key: li.getAttribute('data-item'),
        done: li.textContent!.includes('Done:'),
      })),
    );
    expect(states.filter((s) => !s.done).map((s) => s.key)).toEqual(['notification']);
    expect(states.map((s) => s.key)).toEqual(
      expect.arrayContaining(['assessment', 'labels', 'responsible-person']),
    );
    await eu.getByText('Safety assessment signed for version 2').waitFor();
    await h.screenshot(owner, 'safety-09-readiness');

    expect(h.problems).toEqual([]);
  }, 180_000);
});
