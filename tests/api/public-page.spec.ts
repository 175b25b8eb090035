import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { labelRunRecordSchema, type LabelRunRecord } from '@batchproof/shared';
import { labelRuns } from '../../apps/api/src/db/schema';
import { aLabelRun } from '../../fixtures/builders/label-run-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { giveAddress, releasedFormula } from '../support/label-printing';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
let run: LabelRunRecord;
let otherFormulaName: string;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  await giveAddress(h, w);
  const formulaId = await releasedFormula(h, w, {
    productName: 'Rainfall <b>Fizzer</b> & "Friends"',
    directions: 'Drop one into a warm bath.',
  });
  const otherId = await releasedFormula(h, w, { productName: 'Secret Second Product' });
  otherFormulaName = (
    await request(h.app).get(`/api/formulas/${otherId}`).set(bearer(w.members.owner))
  ).body.name;
  const res = await request(h.app)
    .post('/api/label-runs')
    .set(bearer(w.members.owner))
    .send(aLabelRun(formulaId, { markets: ['US', 'EU'] }));
  expect(res.status).toBe(201);
  run = labelRunRecordSchema.parse(res.body);
});
afterAll(() => h.close());

/** The page as an anonymous reader gets it: no Authorization header, no cookie. */
const read = (path: string) => request(h.app).get(path);

/** The stored content of one market's label, as printed. */
async function printedFields(market: 'US' | 'EU') {
  const [row] = await h.handle.db.select().from(labelRuns).where(eq(labelRuns.id, run.id));
  return row!.contents.find((c) => c.market === market)!.fields;
}

const unescape = (html: string) =>
  html
    .replaceAll('&lt;', '<')
    .replaceAll('&gt;', '>')
    .replaceAll('&quot;', '"')
    .replaceAll('&#39;', "'")
    .replaceAll('&amp;', '&');

describe('the public ingredients page /p/:token', () => {
  it('needs no sign-in and shows every field of the label as printed, warnings included', async () => {
    const res = await read(run.publicPage!.path);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.headers['x-robots-tag']).toBe('noindex');
    const text = unescape(res.text);
    const fields = await printedFields('US');
    expect(fields.map((f) => f.key)).toContain('ingredients');
    for (const field of fields) expect(text).toContain(field.text);
    expect(res.text).toMatch(/<html lang="en-US">/);
    expect(text).toMatch(/responsible for this product and its label/);
    expect(text).toMatch(/Follow the directions and warnings/);
  });

  it("switches to another of the run's markets with ?market=, linking each", async () => {
    const res = await read(`${run.publicPage!.path}?market=EU`);
    expect(res.status).toBe(200);
    expect(res.text).toMatch(/<html lang="en">/);
    for (const field of await printedFields('EU')) expect(unescape(res.text)).toContain(field.text);
    expect(res.text).toContain('href="?market=US"');
    expect(res.text).toMatch(/href="\?market=EU"[^>]*aria-current="page"/);
  });

  it('escapes the text it shows', async () => {
    const res = await read(run.publicPage!.path);
    expect(res.text).toContain('Rainfall &lt;b&gt;Fizzer&lt;/b&gt; &amp; &quot;Friends&quot;');
    expect(res.text).not.toContain('<b>Fizzer</b>');
  });

  it('shows nothing else of the workshop: no other product, no member, no ids', async () => {
    const res = await read(run.publicPage!.path);
    expect(res.text).not.toContain('Secret Second Product');
    expect(res.text).not.toContain(otherFormulaName);
    for (const member of Object.values(w.members)) {
      expect(res.text).not.toContain(member.email);
      expect(res.text).not.toContain(member.name);
    }
    expect(res.text).not.toContain(run.id);
    expect(res.text).not.toContain(run.formulaId);
    expect(res.text).not.toContain(w.id);
    // No script, and the one style element carries the CSP nonce.
    expect(res.text).not.toMatch(/<script/i);
    const nonce = /'nonce-([^']+)'/.exec(res.headers['content-security-policy']!)![1]!;
    expect(res.text).toContain(`<style nonce="${nonce}">`);
  });

  it('answers a plain 404 for a wrong token, and after the owner withdraws the page', async () => {
    const wrong = await read(`/p/${'A'.repeat(43)}`);
    expect(wrong.status).toBe(404);
    expect(wrong.headers['content-type']).toMatch(/^text\/html/);
    expect((await read('/p/short')).status).toBe(404);

    expect(
      (await request(h.app).post(`/api/label-runs/${run.id}/withdraw`).set(bearer(w.members.owner)))
        .status,
    ).toBe(200);
    const gone = await read(run.publicPage!.path);
    expect(gone.status).toBe(404);
    expect(gone.text).not.toContain('Rainfall');
  });
});
