import { useState, type FormEvent } from 'react';
import type { CompanyDto } from '@shared/schemas/company';
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
  const [form, setForm] = useState({ name: company.name, phone: company.phone, timeZone: company.timeZone, tolerance: company.underFiringTolerancePct?.toString() ?? '' });
  const kinds = Object.keys(company.bookingMinutes) as ApplianceKind[];
  const [minutes, setMinutes] = useState<Record<ApplianceKind, string>>(
    Object.fromEntries(kinds.map((k) => [k, String(company.bookingMinutes[k])])) as Record<ApplianceKind, string>,
  );
  const details = update.error instanceof ApiError ? update.error.details : undefined;

  async function submit(e: FormEvent) {
    e.preventDefault();
    const { tolerance, ...rest } = form;
    const underFiringTolerancePct = tolerance.trim() === '' ? null : Number(tolerance);
    const bookingMinutes = Object.fromEntries(kinds.map((k) => [k, Number(minutes[k])]));
    await update.mutateAsync({ ...rest, underFiringTolerancePct, bookingMinutes }).catch(() => {});
  }

  return (
    <Page title="Company settings" subtitle={`Today is ${company.today} in ${company.timeZone}.`}>
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
