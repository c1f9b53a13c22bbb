import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { BookingReplyPage } from '@/features/booking-reply/components/booking-reply-page';
import type { BookingReplyPageDto } from '@shared/schemas/booking-notices';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const PAGE: BookingReplyPageDto = {
  company: { name: 'Wrenfield Steam & Hydronic Service', phone: '555-0142' },
  customerName: 'Ada Fenwick',
  booking: {
    date: '2026-11-24',
    from: '09:00',
    to: '11:00',
    startsAt: '2026-11-24T14:00:00.000Z',
    endsAt: '2026-11-24T16:00:00.000Z',
    timeZone: 'America/New_York',
    technicianFirstName: 'Rowan',
    status: 'booked',
    address: '4 Quill Lane, Alder Falls',
  },
};
const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

function open(fetchImpl: (url: string, init?: RequestInit) => Promise<Response>) {
  vi.stubGlobal('fetch', vi.fn(fetchImpl));
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={qc}>
      <MemoryRouter initialEntries={['/booking-reply/tok']}>
        <Routes>
          <Route path="/booking-reply/:token" element={<BookingReplyPage />} />
        </Routes>
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('the “this time does not suit me” page', () => {
  it('shows the booked window on the company’s clocks and sends the reason and the times that suit', async () => {
    open(async (_url, init) => (init?.method === 'POST' ? json({ id: 'r1', company: PAGE.company }, 201) : json(PAGE)));
    // Source: 15 U.S.C. 260a: New York is on standard time (UTC−5) in late November, so 14:00Z reads 9:00 AM.
    expect(await screen.findByText('Tuesday, November 24, 2026, 9:00 AM to 11:00 AM')).toBeTruthy();
    expect(screen.getByText(/Rowan from Wrenfield/)).toBeTruthy();
    expect(document.title).toBe('Your booked visit · Lifeplate');

    fireEvent.submit(screen.getByRole('button', { name: 'Send to the office' }).closest('form')!);
    expect(await screen.findByText(/Tell us why the time does not suit you/)).toBeTruthy();
    expect(fetch).toHaveBeenCalledTimes(1);

    fireEvent.change(screen.getByLabelText('Why does this time not suit you?'), { target: { value: 'At work that morning' } });
    fireEvent.change(screen.getByLabelText('When would suit you?'), { target: { value: 'Weekday afternoons' } });
    fireEvent.submit(screen.getByRole('button', { name: 'Send to the office' }).closest('form')!);
    expect((await screen.findByRole('status')).textContent).toContain('the visit stays booked');
    const [url, init] = vi.mocked(fetch).mock.calls[1] as [string, RequestInit];
    expect(url).toBe('/api/booking-reply/tok');
    expect(JSON.parse(String(init.body))).toEqual({ contactName: 'Ada Fenwick', contactPhone: null, reason: 'At work that morning', preferredTimes: 'Weekday afternoons' });
  });

  it('says the link does not work for a bad or expired link', async () => {
    open(async () => json({ error: { code: 'not_found', message: 'Booking not found' } }, 404));
    expect(await screen.findByText('This link does not work any more')).toBeTruthy();
  });
});
