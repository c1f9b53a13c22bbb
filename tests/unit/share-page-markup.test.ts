import { describe, expect, it, vi } from 'vitest';
import { sharePageMarkup } from '../../server/spa/share-page-markup';
import type { HomeownerViewDto } from '@shared/schemas/homeowner';

describe('share page markup rendered on the server', () => {
  it('logs a render failure and gives no markup, so the page is served as before', () => {
    const warn = vi.fn();
    // A view without its appliance makes the component throw while rendering.
    const broken = { company: { name: 'Invented Heating Co', phone: '555-0100' } } as unknown as HomeownerViewDto;
    expect(sharePageMarkup('tok', broken, { warn })).toBe('');
    expect(warn).toHaveBeenCalledTimes(1);
    expect(warn.mock.calls[0][1]).toBe('share page first screen not rendered on the server');
  });
});
