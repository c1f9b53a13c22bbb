import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { makeupWaterEntryInput } from '@shared/schemas/makeup-water';
import { todayInTimeZone } from '@shared/dates';
import { useAddMakeupWater, useMakeupWater } from '../api/makeup-water';
import { Section } from './section';
import { RECORD_SECTIONS } from '@shared/glossary';

const gal = (n: number | null | undefined, digits = 1) => (n == null ? '—' : `${n.toFixed(digits)} gal`);

/** Monthly water use as bars, so a rise across the heating season shows at a glance. */
function MonthlyBars({ monthly }: { monthly: { month: string; gallons: number }[] }) {
  const shown = monthly.slice(-18);
  if (shown.length < 2) return null;
  const max = Math.max(...shown.map((m) => m.gallons), 1);
  const w = 300;
  const h = 70;
  const bw = w / shown.length;
  return (
    <svg viewBox={`0 0 ${w} ${h + 14}`} className="mb-2 h-24 w-full" role="img" aria-label={`Makeup water by month, highest ${max.toFixed(1)} gallons`}>
      {shown.map((m, i) => {
        const bh = (m.gallons / max) * h;
        return (
          <g key={m.month}>
            <rect x={i * bw + 2} y={h - bh} width={bw - 4} height={bh} fill="currentColor" opacity={0.75}>
              <title>{`${m.month}: ${m.gallons.toFixed(1)} gal`}</title>
            </rect>
            {(i === 0 || i === shown.length - 1 || m.month.endsWith('-01')) && (
              <text x={i * bw + bw / 2} y={h + 12} fontSize="9" textAnchor="middle" fill="currentColor">
                {m.month}
              </text>
            )}
          </g>
        );
      })}
    </svg>
  );
}

export function MakeupWaterSection({ applianceId, timeZone, canRecord }: { applianceId: string; timeZone: string; canRecord: boolean }) {
  const water = useMakeupWater(applianceId);
  const add = useAddMakeupWater(applianceId);
  const [form, setForm] = useState({ kind: 'meter_reading' as 'meter_reading' | 'added_by_hand', recordedOn: todayInTimeZone(timeZone), gallons: '' });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const analysis = water.data?.analysis;

  async function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = makeupWaterEntryInput.safeParse({ ...form, gallons: form.gallons === '' ? (form.kind === 'added_by_hand' ? null : undefined) : Number(form.gallons) });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [i.path.join('.'), [i.message]])));
      return;
    }
    setErrors({});
    try {
      await add.mutateAsync(parsed.data);
      setForm({ ...form, gallons: '' });
    } catch (err) {
      if (err instanceof ApiError && err.details) setErrors(err.details);
    }
  }

  return (
    <Section folded title={RECORD_SECTIONS.makeupWater}>
      <p className="mb-2 text-sm">
        A steam boiler that needs water more often than about once a month should be checked for leaks: excess makeup water brings in oxygen and minerals
        that corrode the boiler (common practice).
      </p>
      <Notice kind="caution" title="Never add cold water to a hot boiler">
        If no water shows in the gauge glass, do not add any: shut off the burner and let the boiler cool first.
      </Notice>
      {water.data && !analysis && <p className="my-2 text-iron-muted">Two or more entries are needed before a rate can be worked out.</p>}
      {analysis && (
        <div className="my-2 flex flex-col gap-2">
          <dl className="tabular grid grid-cols-2 gap-2 sm:grid-cols-4">
            <div>
              <dt className="text-xs font-semibold uppercase text-iron-muted">Per week</dt>
              <dd className="font-bold">{gal(analysis.gallonsPerWeek)}</dd>
            </div>
            <div>
              <dt className="text-xs font-semibold uppercase text-iron-muted">Per month</dt>
              <dd className="font-bold">{gal(analysis.gallonsPerMonth)}</dd>
            </div>
            <div>
              <dt className="text-xs font-semibold uppercase text-iron-muted">Last 30 days</dt>
              <dd className="font-bold">{gal(analysis.latest30DayGallons)}</dd>
            </div>
            <div>
              <dt className="text-xs font-semibold uppercase text-iron-muted">Fills per month</dt>
              <dd className="font-bold">{analysis.fillEventsPerMonth == null ? '—' : analysis.fillEventsPerMonth.toFixed(1)}</dd>
            </div>
          </dl>
          {analysis.flags.map((f) => (
            <Notice key={f.code} kind={f.severity === 'info' ? 'info' : 'caution'} title={f.message}>
              <span className="text-xs">Basis: {f.source}</span>
            </Notice>
          ))}
          <MonthlyBars monthly={analysis.monthly} />
        </div>
      )}
      {canRecord && (
        <form onSubmit={submit} noValidate className="mt-2 grid gap-2 sm:grid-cols-4 sm:items-end">
          <SelectField label="Entry" value={form.kind} onChange={(e) => setForm({ ...form, kind: e.target.value as typeof form.kind })}>
            <option value="meter_reading">Feeder meter reading</option>
            <option value="added_by_hand">Water added by hand</option>
          </SelectField>
          <TextField label="Date" type="date" value={form.recordedOn} onChange={(e) => setForm({ ...form, recordedOn: e.target.value })} error={errors.recordedOn} />
          <TextField
            label={form.kind === 'meter_reading' ? 'Meter (gal)' : 'Gallons (if known)'}
            inputMode="decimal"
            value={form.gallons}
            onChange={(e) => setForm({ ...form, gallons: e.target.value })}
            error={errors.gallons}
          />
          <Button type="submit" disabled={add.isPending}>
            {add.isPending ? 'Saving…' : 'Add entry'}
          </Button>
        </form>
      )}
    </Section>
  );
}
