import type { Page } from 'playwright-core';
import { expect } from 'vitest';

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
        // Content inside a sideways scroller is meant to be wider than the window.
        if (el.closest('.scroller')) continue;
        out.push(
          `${el.tagName.toLowerCase()}.${[...el.classList].join('.')} (right ${Math.round(rect.right)}px)`,
        );
      }
    }
    return out;
  });
}

/**
 * Asserts that nothing sticks out sideways once the layout has settled: after a resize the side
 * navigation and the content's margin animate for a moment, so the check is repeated for up to
 * three seconds; anything still overflowing then fails the journey.
 */
export async function expectNoSidewaysOverflow(page: Page): Promise<void> {
  await expect.poll(() => overflowingElements(page), { timeout: 3000, interval: 200 }).toEqual([]);
}
