import { useState, type FormEvent } from 'react';
import type { CompanyDto } from '@shared/schemas/company';
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
  const details = update.error instanceof ApiError ? update.error.details : undefined;

  async function submit(e: FormEvent) {
    e.preventDefault();
    const { tolerance, ...rest } = form;
    const underFiringTolerancePct = tolerance.trim() === '' ? null : Number(tolerance);
    await update.mutateAsync({ ...rest, underFiringTolerancePct }).catch(() => {});
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
          <Button type="submit" disabled={update.isPending}>
            {update.isPending ? 'Saving…' : 'Save'}
          </Button>
        </form>
      </Card>
    </Page>
  );
}
