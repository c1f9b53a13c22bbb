import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Page, Spinner } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { StatusBadge, type Status } from '@/components/ui/status-badge';
import { LABELS, APPLIANCE_KINDS, type ApplianceKind } from '@shared/schemas/enums';
import type { DueItemStatus } from '@shared/schemas/due';
import { useDue } from '../api/get-due';
import { useTechnicians } from '@/lib/resources/members';
import { bookingHref } from '@/lib/booking-link';
import { useMe } from '@/lib/auth';
import { can } from '@shared/policy';
import { StockForecast } from './stock-forecast';
import { AnnualServiceDue } from './annual-service-due';
import { ReplacementProspects } from './replacement-prospects';
import { RemindersSent } from './reminders-sent';

const STATUS: Record<DueItemStatus, { look: Status; word: string }> = {
  replace_now: { look: 'due', word: 'Replace now' },
  overdue: { look: 'due', word: 'Overdue' },
  due_soon: { look: 'soon', word: 'Due soon' },
  later: { look: 'info', word: 'Later' },
};

export function DueListPage() {
  const [withinDays, setWithinDays] = useState(90);
  const [applianceKind, setApplianceKind] = useState<ApplianceKind | ''>('');
  const [technicianId, setTechnicianId] = useState('');
  const [town, setTown] = useState('');
  const [type, setType] = useState('');
  const [cursors, setCursors] = useState<string[]>([]);
  const technicians = useTechnicians();
  const query = {
    withinDays,
    applianceKind: applianceKind || undefined,
    technicianId: technicianId || undefined,
    town: town.trim() || undefined,
    type: type.trim() || undefined,
    after: cursors.at(-1),
    limit: 50,
  };
  const due = useDue(query);
  const resetPaging = () => setCursors([]);
  const canBook = can(useMe().data?.principal, 'bookings:manage');

  return (
    <Page
      title="Due list"
      subtitle="Parts and inspections coming due across all customers, from each part's age and condition."
      actions={
        <div className="no-print flex gap-2">
          <a
            className="inline-flex min-h-tap items-center rounded-plate border border-plate-line bg-plate-deep px-4 font-semibold"
            href={`/api/due/export.csv?${new URLSearchParams(Object.entries({ ...query, after: undefined, limit: undefined }).filter((e): e is [string, string | number] => e[1] !== undefined && e[1] !== '').map(([k, v]) => [k, String(v)])).toString()}`}
            download
          >
            Export CSV
          </a>
          <Button variant="secondary" onClick={() => window.print()}>
            Print
          </Button>
        </div>
      }
    >
      <Card className="no-print">
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
          <SelectField label="Window" value={withinDays} onChange={(e) => (setWithinDays(Number(e.target.value)), resetPaging())}>
            {[30, 60, 90, 180, 365].map((d) => (
              <option key={d} value={d}>
                Next {d} days
              </option>
            ))}
          </SelectField>
          <TextField label="Part type" placeholder="e.g. thermocouple" value={type} onChange={(e) => (setType(e.target.value), resetPaging())} />
          <SelectField label="Appliance kind" value={applianceKind} onChange={(e) => (setApplianceKind(e.target.value as ApplianceKind | ''), resetPaging())}>
            <option value="">Any</option>
            {APPLIANCE_KINDS.map((k) => (
              <option key={k} value={k}>
                {LABELS.applianceKind[k]}
              </option>
            ))}
          </SelectField>
          <SelectField label="Technician" value={technicianId} onChange={(e) => (setTechnicianId(e.target.value), resetPaging())}>
            <option value="">Anyone</option>
            {technicians.data?.map((t) => (
              <option key={t.userId} value={t.userId}>
                {t.name}
              </option>
            ))}
          </SelectField>
          <TextField label="Town" value={town} onChange={(e) => (setTown(e.target.value), resetPaging())} />
        </div>
      </Card>

      <StockForecast withinDays={withinDays} />
      {due.isPending ? (
        <Spinner />
      ) : due.error ? (
        <p role="alert" className="text-due">
          {due.error.message}
        </p>
      ) : (
        <Card title={`${due.data.items.length}${due.data.nextCursor ? '+' : ''} due`}>
          {!due.data.items.length ? (
            <p>Nothing falls due in this window with these filters.</p>
          ) : (
            <div className="overflow-x-auto">
              <table className="tabular w-full text-left text-sm">
                <thead>
                  <tr className="border-b-2 border-plate-line">
                    <th className="py-2 pr-3">Due</th>
                    <th className="pr-3">Status</th>
                    <th className="pr-3">What</th>
                    <th className="pr-3">Part</th>
                    <th className="pr-3">Customer and site</th>
                    <th className="pr-3">Technician</th>
                    {canBook && <th className="no-print pr-3">Booking</th>}
                  </tr>
                </thead>
                <tbody>
                  {due.data.items.map((item) => (
                    <tr key={item.componentId} className="border-b border-plate-line align-top">
                      <td className="py-2 pr-3 whitespace-nowrap">{item.dueOn}</td>
                      <td className="pr-3">
                        <StatusBadge status={STATUS[item.status].look}>{STATUS[item.status].word}</StatusBadge>
                      </td>
                      <td className="pr-3">{item.dueKind === 'replacement' ? 'Replace' : 'Inspect'}</td>
                      <td className="pr-3">
                        <Link className="font-semibold text-brass-dark underline" to={`/appliances/${item.appliance.id}`}>
                          {item.typeLabel}
                          {item.specKey ? `, ${item.specKey}` : ''}
                        </Link>
                        <p className="text-xs text-iron-muted">{item.reason}</p>
                      </td>
                      <td className="pr-3">
                        {item.customer.name}
                        <p className="text-xs text-iron-muted">
                          {item.site.street}, {item.site.town} · {LABELS.applianceKind[item.appliance.kind]}
                        </p>
                      </td>
                      <td className="pr-3">{item.site.assignedTechnicianName ?? '—'}</td>
                      {canBook && (
                        <td className="no-print pr-3">
                          <Link className="inline-flex min-h-tap items-center font-semibold underline" to={bookingHref({ applianceIds: [item.appliance.id], source: 'due_list' })}>
                            Book<span className="sr-only"> {item.typeLabel} at {item.site.street}</span>
                          </Link>
                        </td>
                      )}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          <div className="no-print mt-3 flex gap-2">
            <Button variant="secondary" disabled={!cursors.length} onClick={() => setCursors(cursors.slice(0, -1))}>
              Previous page
            </Button>
            <Button variant="secondary" disabled={!due.data.nextCursor} onClick={() => setCursors([...cursors, due.data.nextCursor!])}>
              Next page
            </Button>
          </div>
        </Card>
      )}
      <AnnualServiceDue />
      <RemindersSent />
      <ReplacementProspects />
    </Page>
  );
}
