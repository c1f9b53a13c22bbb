import { useState, type FormEvent } from 'react';
import { DUE_SOON_DAYS_MAX, DUE_SOON_DAYS_MIN, type CompanyDto } from '@shared/schemas/company';
import { formatCalendarDate } from '@shared/format/dates';
import { LABELS, type ApplianceKind } from '@shared/schemas/enums';
import { Page, Spinner } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { useCompany } from '../api/get-company';
import { useUpdateCompany } from '../api/update-company';

const TIME_ZONES = Intl.supportedValuesOf('timeZone');

export function CompanySettingsPage() {
  const company = useCompany();
  if (company.isPending || !company.data) return <Spinner />;
  return <CompanySettingsForm company={company.data} />;
}

function CompanySettingsForm({ company }: { company: CompanyDto }) {
  const update = useUpdateCompany();
  const [form, setForm] = useState({ name: company.name, phone: company.phone, timeZone: company.timeZone, tolerance: company.underFiringTolerancePct?.toString() ?? '', dueSoonDays: String(company.dueSoonDays) });
  const kinds = Object.keys(company.bookingMinutes) as ApplianceKind[];
  const [minutes, setMinutes] = useState<Record<ApplianceKind, string>>(
    Object.fromEntries(kinds.map((k) => [k, String(company.bookingMinutes[k])])) as Record<ApplianceKind, string>,
  );
  const details = update.error instanceof ApiError ? update.error.details : undefined;

  async function submit(e: FormEvent) {
    e.preventDefault();
    const { tolerance, dueSoonDays: soon, ...rest } = form;
    const underFiringTolerancePct = tolerance.trim() === '' ? null : Number(tolerance);
    // An empty or non-numeric entry is sent as typed, so the server's field message says what is wrong.
    const dueSoonDays = soon.trim() === '' || Number.isNaN(Number(soon)) ? soon : Number(soon);
    const bookingMinutes = Object.fromEntries(kinds.map((k) => [k, Number(minutes[k])]));
    await update.mutateAsync({ ...rest, underFiringTolerancePct, dueSoonDays: dueSoonDays as number, bookingMinutes }).catch(() => {});
  }

  return (
    <Page title="Company settings" subtitle={`Today is ${formatCalendarDate(company.today, { long: true })} in ${company.timeZone}.`}>
      <Card>
        <form onSubmit={submit} noValidate className="flex max-w-md flex-col gap-4">
          {update.isSuccess && <Notice title="Saved">Your changes are saved.</Notice>}
          <TextField label="Company name" value={form.name} onChange={(e) => setForm({ ...form, name: e.target.value })} error={details?.name} />
          <TextField label="Phone shown to customers" value={form.phone} onChange={(e) => setForm({ ...form, phone: e.target.value })} error={details?.phone} />
          <SelectField
            label="Time zone"
            hint='Decides what "due today" means.'
            value={form.timeZone}
            onChange={(e) => setForm({ ...form, timeZone: e.target.value })}
            error={details?.timeZone}
          >
            {TIME_ZONES.map((tz) => (
              <option key={tz}>{tz}</option>
            ))}
          </SelectField>
          <TextField
            label="Under-firing tolerance (%)"
            inputMode="numeric"
            hint="How far below the nameplate input a clocked gas input may be before the visit flags it. Leave empty to judge over-firing only (always prohibited)."
            value={form.tolerance}
            onChange={(e) => setForm({ ...form, tolerance: e.target.value })}
            error={details?.underFiringTolerancePct}
          />
          <TextField
            label='"Due soon" window (days)'
            inputMode="numeric"
            hint={`Parts and inspections due within this many days read "Due soon" on records and the due list; parts due for replacement within it are reminded by e-mail. ${DUE_SOON_DAYS_MIN} to ${DUE_SOON_DAYS_MAX} days.`}
            value={form.dueSoonDays}
            onChange={(e) => setForm({ ...form, dueSoonDays: e.target.value })}
            error={details?.dueSoonDays}
          />
          <fieldset className="flex flex-col gap-3">
            <legend className="text-sm font-semibold">Booking window by appliance (minutes)</legend>
            <p className="text-xs text-iron-muted">A new booking proposes this length; the office can change it on each booking.</p>
            {kinds.map((k) => (
              <TextField
                key={k}
                label={LABELS.applianceKind[k]}
                inputMode="numeric"
                value={minutes[k]}
                onChange={(e) => setMinutes({ ...minutes, [k]: e.target.value })}
                error={details?.[`bookingMinutes.${k}`]}
              />
            ))}
          </fieldset>
          <Button type="submit" disabled={update.isPending}>
            {update.isPending ? 'Saving…' : 'Save'}
          </Button>
        </form>
      </Card>
    </Page>
  );
}
