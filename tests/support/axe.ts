import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';

// WCAG 2.2 level A and AA, as axe-core tags them (axe-core rule descriptions, Deque, 4.13).
const WCAG_22_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/** The serious and critical axe-core violations on the page as it stands, one readable line per node. */
export async function seriousAxeViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(WCAG_22_AA).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .flatMap((v) => v.nodes.map((n) => `${v.id} (${v.impact}): ${n.target.join(' ')} — ${n.failureSummary?.split('\n').join(' ') ?? v.help}`));
}
