import { randomBytes } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';

/** A run id that keeps this journey's workshop and e-mail apart from any other run. */
export const runId = () => `${Date.now().toString(36)}${randomBytes(3).toString('hex')}`;

/**
 * Writes a tiny but well-formed PDF (the API recognises it from its `%PDF-` header) into a new
 * temporary folder and returns its path.
 */
export function writeSmallPdf(name: string): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'batchproof-journey-'));
  const file = path.join(dir, name);
  writeFileSync(
    file,
    '%PDF-1.4\n1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj\n' +
      '2 0 obj << /Type /Pages /Kids [] /Count 0 >> endobj\n' +
      'trailer << /Root 1 0 R >>\n%%EOF\n',
  );
  return file;
}

/** A calendar date `days` before today, as YYYY-MM-DD. */
export function daysAgo(days: number): string {
  return new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);
}

/** Picks `option` in the Material select labelled `label`, scoped to `within` when given. */
export async function choose(page: Page, label: string, option: string | RegExp): Promise<void> {
  await page.getByRole('combobox', { name: label, exact: true }).click();
  await page.getByRole('option', { name: option }).click();
}

/** A `YYYY-MM-DD` day as the app shows it in the browser's locale (e.g. "Mar 1, 2025" in en-US). */
export async function shownDay(page: Page, day: string): Promise<string> {
  return page.evaluate(
    (d) =>
      new Intl.DateTimeFormat(navigator.language, {
        day: 'numeric',
        month: 'short',
        year: 'numeric',
        timeZone: 'UTC',
      }).format(new Date(`${d}T00:00:00Z`)),
    day,
  );
}
