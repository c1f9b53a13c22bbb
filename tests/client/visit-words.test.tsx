import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { ServerResults } from '@/features/visits/components/server-results';
import { SwapParts } from '@/features/visits/components/swap-parts';
import { GENERIC_QUICK_REASONS, RESULT_WORDS, STORED_RESULTS_NOTE } from '@shared/glossary';
import type { ComponentDto } from '@shared/schemas/records';
import type { VisitDto } from '@shared/schemas/visits';
import { analyzeCombustion } from '@shared/trade/combustion';

afterEach(cleanup);

describe('stored visit results in the technician’s words', () => {
  // Readings of the API tests' GOOD_COMBUSTION: 7 % O2 and 50 ppm CO give 75 ppm air-free (CO × 20.9 / (20.9 − 7)).
  const combustion = analyzeCombustion({ fuel: 'natural_gas', o2Pct: 7, coPpm: 50, flueTempF: 400, airTempF: 70 });

  it('says what each value means and that it was worked out from the readings, never "computed by the server"', () => {
    render(<ServerResults results={{ combustion }} />);
    const region = screen.getByRole('region', { name: 'Kept with the visit' });
    expect(region.textContent).not.toMatch(/server|computed/i);
    expect(within(region).getByText(STORED_RESULTS_NOTE)).toBeTruthy();
    expect(region.querySelector('[data-result="CO air-free"]')!.textContent).toBe('75 ppm');
    expect(within(region).getByText(RESULT_WORDS.coAirFree.meaning)).toBeTruthy();
  });

  it('keeps the formula folded away until asked for', () => {
    render(<ServerResults results={{ combustion }} />);
    const details = screen.getByText('How these are worked out').closest('details')!;
    expect(details.open).toBe(false);
    expect(details.textContent).toContain('CO·20.9/(20.9 − O2)');
    fireEvent.click(screen.getByText('How these are worked out'));
    expect(details.open).toBe(true);
  });
});

const part = (id: string, typeCode: string, typeLabel: string): ComponentDto => ({
  id,
  typeCode,
  typeLabel,
  description: null,
  spec: {},
  specKey: '',
  installedOn: null,
  originalWithAppliance: false,
  note: null,
  conditionFailed: false,
  conditionNote: null,
  lastInspectedOn: null,
  removedOn: null,
  removalReason: null,
  replacedById: null,
  due: null,
});

const visit = { id: 'v1', swaps: [] } as unknown as VisitDto;

function quickReasonsOf(partLabel: string) {
  fireEvent.click(screen.getByRole('button', { name: new RegExp(`^${partLabel}`) }));
  const group = within(screen.getByRole('dialog')).getByRole('group', { name: 'Quick reasons' });
  const reasons = within(group).getAllByRole('button').map((b) => b.textContent);
  fireEvent.click(within(screen.getByRole('dialog')).getByRole('button', { name: 'Cancel' }));
  return reasons;
}

describe('part swap quick reasons', () => {
  it('offers each part type its own reasons, and generic ones for a company’s own type', () => {
    const components = [part('c1', 'thermocouple', 'thermocouple'), part('c2', 'burners', 'burners'), part('c3', 'zone_valve', 'zone valve')];
    render(
      <QueryClientProvider client={new QueryClient()}>
        <SwapParts visit={visit} components={components} onSwapped={() => {}} />
      </QueryClientProvider>,
    );
    expect(quickReasonsOf('thermocouple')).toEqual(expect.arrayContaining(['low millivolts', 'pilot drops out']));
    const burner = quickReasonsOf('burners');
    expect(burner.join(' ')).not.toMatch(/glass|etched|millivolt/);
    expect(burner).toContain('rusted or scaled');
    expect(quickReasonsOf('zone valve')).toEqual([...GENERIC_QUICK_REASONS]);
  });

  it('a tapped reason fills the reason field', () => {
    render(
      <QueryClientProvider client={new QueryClient()}>
        <SwapParts visit={visit} components={[part('c1', 'gauge_glass', 'gauge glass')]} onSwapped={() => {}} />
      </QueryClientProvider>,
    );
    fireEvent.click(screen.getByRole('button', { name: /^gauge glass/ }));
    fireEvent.click(screen.getByRole('button', { name: 'etched or cloudy' }));
    expect((screen.getByLabelText('Reason') as HTMLInputElement).value).toBe('etched or cloudy');
  });
});
