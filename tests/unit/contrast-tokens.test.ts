import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import config from '../../tailwind.config';
import { contrastRatio } from '../../src/components/ui/contrast';

// The light theme's value is the fallback inside each token, `var(--lp-ok, #22614F)`; the dim theme's is in index.css.
const colors = config.theme.extend.colors as Record<string, string | Record<string, string>>;
const light = (name: string, shade = 'DEFAULT') => {
  const v = colors[name];
  const raw = typeof v === 'string' ? v : v[shade];
  return raw.match(/#[0-9a-fA-F]{6}/)![0];
};
const css = readFileSync(new URL('../../src/index.css', import.meta.url), 'utf8');
const dim = (variable: string) => css.match(new RegExp(`--lp-${variable}:\\s*(#[0-9a-fA-F]{6})`))![1];

describe('contrastRatio', () => {
  // Source: WCAG 2.2, definition "contrast ratio": ratios range from 1 to 21 (black on white).
  it('gives 21:1 for black on white and 1:1 for a colour on itself', () => {
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 5);
    expect(contrastRatio('#22614F', '#22614F')).toBeCloseTo(1, 5);
  });
});

// Source: WCAG 2.2 SC 1.4.3 Contrast (Minimum), level AA: text at least 4.5:1.
describe('status pills and muted text reach 4.5:1 in both themes', () => {
  const statuses = ['ok', 'soon', 'due'];
  it.each(statuses)('%s on its soft background and on the card, light theme', (s) => {
    expect(contrastRatio(light(s), light(s, 'soft'))).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(light(s), light('surface'))).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(light(s), light('plate'))).toBeGreaterThanOrEqual(4.5);
  });
  it.each([...statuses, 'unsafe'])('%s on its soft background, dim theme', (s) => {
    expect(contrastRatio(dim(s), dim(`${s}-soft`))).toBeGreaterThanOrEqual(4.5);
  });
  it('unsafe, muted and brass text on the page and the card', () => {
    expect(contrastRatio(light('unsafe'), light('surface'))).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(light('iron', 'muted'), light('plate'))).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(light('brass', 'dark'), light('plate'))).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(dim('iron-muted'), dim('plate'))).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(dim('iron-muted'), dim('surface'))).toBeGreaterThanOrEqual(4.5);
  });
});

// Source: WCAG 2.2 SC 1.4.11 Non-text Contrast, level AA: a focus indicator at least 3:1 against what is next to it.
describe('the focus ring', () => {
  it('stands out at 3:1 on the page, the card, the header and the dim page', () => {
    const ring = light('brass');
    for (const bg of [light('plate'), light('surface'), light('header'), dim('plate'), dim('surface')]) {
      expect(contrastRatio(ring, bg)).toBeGreaterThanOrEqual(3);
    }
  });
});
