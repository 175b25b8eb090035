import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { expect } from 'vitest';

/** The widths every page is checked and photographed at: a phone, a tablet, a laptop. */
export const LAYOUT_WIDTHS = [360, 768, 1280] as const;

/** Names of visible elements that stick out past the right edge of the window. */
export async function overflowingElements(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    const out: string[] = [];
    if (document.documentElement.scrollWidth > width)
      out.push(`document (${document.documentElement.scrollWidth}px)`);
    for (const el of Array.from(document.body.querySelectorAll('*'))) {
      const rect = el.getBoundingClientRect();
      if (rect.width > 0 && rect.height > 0 && rect.right > width + 1) {
        // Content inside a sideways scroller (a table in its own scrolling box) is meant to be
        // wider than the window; the document itself must not scroll.
        let box = el.parentElement;
        while (box && !/auto|scroll/.test(getComputedStyle(box).overflowX)) box = box.parentElement;
        if (box && box !== document.documentElement && box !== document.body) continue;
        // The closed overlay navigation waits off-screen, hidden.
        if (getComputedStyle(el).visibility === 'hidden') continue;
        out.push(
          `${el.tagName.toLowerCase()}.${[...el.classList].join('.')} (right ${Math.round(rect.right)}px)`,
        );
      }
    }
    return out;
  });
}

/**
 * Visible text the reader cannot see whole: an element that clips or ellipsises its own text
 * (scrollWidth past clientWidth under `overflow: hidden`/`clip` or `text-overflow: ellipsis`)
 * with no `title` or tooltip giving the whole text, and a form field's hint or error that runs
 * past the room under the field (where it overlaps the next field or is cut off).
 */
export async function clippedTextElements(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    const describe = (el: Element) =>
      `${el.tagName.toLowerCase()}${[...el.classList].map((c) => `.${c}`).join('')} "${(el.textContent ?? '').replace(/\s+/g, ' ').trim().slice(0, 60)}"`;
    const visible = (el: Element) => {
      const rect = el.getBoundingClientRect();
      const style = getComputedStyle(el);
      return rect.width > 2 && rect.height > 2 && style.visibility !== 'hidden';
    };
    const explained = (el: Element) =>
      el.closest('[title], [mattooltip], .mat-mdc-tooltip-trigger') !== null;

    const scrolls = (el: Element) => /auto|scroll/.test(getComputedStyle(el).overflowX);
    for (const el of Array.from(document.body.querySelectorAll('*'))) {
      if (el.closest('mat-icon, .mat-icon, svg, canvas, .bp-visually-hidden, .cdk-visually-hidden'))
        continue;
      const style = getComputedStyle(el);
      const clips =
        style.textOverflow === 'ellipsis' ||
        style.overflowX === 'hidden' ||
        style.overflowX === 'clip';
      if (!clips || el.scrollWidth <= el.clientWidth + 1 || !visible(el) || explained(el)) continue;
      // Measure the text itself: a box may clip wide children on purpose, but not words.
      const box = el.getBoundingClientRect();
      const walker = document.createTreeWalker(el, NodeFilter.SHOW_TEXT);
      for (let node = walker.nextNode(); node; node = walker.nextNode()) {
        if ((node.textContent ?? '').trim() === '') continue;
        const parent = node.parentElement!;
        // Text inside a scroller nested in the box can be scrolled to; hidden text is not shown.
        let inner: Element | null = parent;
        let reachable = false;
        while (inner && inner !== el) {
          if (scrolls(inner) || getComputedStyle(inner).display === 'none') reachable = true;
          inner = inner.parentElement;
        }
        if (reachable || !visible(parent)) continue;
        const range = document.createRange();
        range.selectNodeContents(node);
        const cut = Array.from(range.getClientRects()).some(
          (r) => r.width > 0 && (r.right > box.right + 1 || r.left < box.left - 1),
        );
        if (cut) {
          out.push(`clipped ${describe(parent)} (${el.scrollWidth}px in ${el.clientWidth}px)`);
          break;
        }
      }
    }

    // A word in a table cell broken across lines (an e-mail address in fragments): a table
    // should widen its column and scroll in its own box instead.
    for (const cell of Array.from(document.querySelectorAll('td, th'))) {
      if (!visible(cell)) continue;
      const walker = document.createTreeWalker(cell, NodeFilter.SHOW_TEXT);
      for (let node = walker.nextNode(); node; node = walker.nextNode()) {
        const text = node.textContent ?? '';
        for (const match of text.matchAll(/[\p{L}\p{N}@._]{4,}/gu)) {
          const range = document.createRange();
          range.setStart(node, match.index);
          range.setEnd(node, match.index + match[0].length);
          const tops = new Set(
            Array.from(range.getClientRects())
              .filter((r) => r.width > 0)
              .map((r) => Math.round(r.top)),
          );
          if (tops.size > 1) out.push(`word broken mid-word "${match[0]}" in ${describe(cell)}`);
        }
      }
    }

    // A hint or error under a form field lives in a fixed-height strip; text that needs more
    // room than the strip spills over the next field or past the field's edge.
    for (const strip of Array.from(
      document.querySelectorAll('.mat-mdc-form-field-subscript-wrapper'),
    )) {
      if (!visible(strip)) continue;
      const box = strip.getBoundingClientRect();
      for (const text of Array.from(strip.querySelectorAll('mat-hint, mat-error'))) {
        if (!visible(text)) continue;
        const r = text.getBoundingClientRect();
        if (r.bottom > box.bottom + 1 || r.right > box.right + 1 || r.left < box.left - 1) {
          out.push(`hint runs out of its field ${describe(text)}`);
        }
      }
    }
    return out;
  });
}

/** Polls `check` for up to three seconds (a resize settles over a few frames) until it finds nothing. */
async function expectNone(check: () => Promise<string[]>, message: string): Promise<void> {
  await expect.poll(check, { timeout: 3000, interval: 200, message }).toEqual([]);
}

/**
 * Asserts that nothing sticks out sideways once the layout has settled: after a resize the side
 * navigation and the content's margin animate for a moment; anything still overflowing after
 * three seconds fails the journey.
 */
export const expectNoSidewaysOverflow = (page: Page, where = '') =>
  expectNone(() => overflowingElements(page), `sideways overflow ${where}`);

/** Asserts that no text on the page is clipped without a way to read it whole. */
export const expectNoClippedText = (page: Page, where = '') =>
  expectNone(() => clippedTextElements(page), `clipped text ${where}`);

/**
 * Waits until the page has been still for a moment: a resize reaches the app through a media
 * query listener, and only then do the navigation and the content's margin start to slide, so
 * "no animation running" counts only once it has held for a few frames in a row.
 */
async function settle(page: Page): Promise<void> {
  await page.evaluate(async () => {
    const frame = () => new Promise((resolve) => requestAnimationFrame(resolve));
    const moving = () =>
      document
        .getAnimations()
        .some(
          (a) => a.playState === 'running' && a.effect?.getComputedTiming().iterations !== Infinity,
        );
    const deadline = performance.now() + 3000;
    let still = 0;
    while (still < 6 && performance.now() < deadline) {
      await frame();
      still = moving() ? 0 : still + 1;
    }
  });
}

/**
 * Checks the page at 360, 768 and 1280 px wide: no sideways overflow and no clipped text, then a
 * full-page screenshot at each width as `<name>-<width>.png` under `dir`. The window goes back to
 * its own size afterwards, so the journey carries on as before. Returns the files written.
 */
export async function checkLayoutAtWidths(
  page: Page,
  name: string,
  dir: string,
): Promise<string[]> {
  mkdirSync(dir, { recursive: true });
  const original = page.viewportSize() ?? { width: 1280, height: 800 };
  const files: string[] = [];
  for (const width of LAYOUT_WIDTHS) {
    await page.setViewportSize({ width, height: original.height });
    await settle(page);
    // The picture first, so a failing check leaves it behind to look at.
    const file = path.join(dir, `${name}-${width}.png`);
    await page.screenshot({ path: file, fullPage: true });
    files.push(file);
    const where = `on ${name} at ${width}px`;
    await expectNoSidewaysOverflow(page, where);
    await expectNoClippedText(page, where);
  }
  await page.setViewportSize(original);
  await settle(page);
  return files;
}
