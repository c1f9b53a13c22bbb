import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { Page, Spinner } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { StatusBadge, type Status } from '@/components/ui/status-badge';
import { LABELS, APPLIANCE_KINDS, type ApplianceKind } from '@shared/schemas/enums';
import type { DueItemDto, DueItemStatus } from '@shared/schemas/due';
import { formatCalendarDate } from '@shared/format/dates';
import { useDue } from '../api/get-due';
import { useTechnicians } from '@/lib/resources/members';
import { bookingHref } from '@/lib/booking-link';
import { useMe } from '@/lib/auth';
import { can } from '@shared/policy';
import { StockForecast } from './stock-forecast';
import { AnnualServiceDue } from './annual-service-due';
import { ReplacementProspects } from './replacement-prospects';
import { RemindersSent } from './reminders-sent';
import { DueJumpBar, DueSection, useDueSection } from './due-sections';
import { useDueStock } from '../api/get-due-stock';
import { useAnnualServiceDue } from '../api/get-annual-service-due';
import { useReplacementProspects } from '../api/get-replacement-prospects';
import { useReminders } from '../api/get-reminders';

const STATUS: Record<DueItemStatus, { look: Status; word: string }> = {
  replace_now: { look: 'due', word: 'Replace now' },
  overdue: { look: 'due', word: 'Overdue' },
  due_soon: { look: 'soon', word: 'Due soon' },
  later: { look: 'info', word: 'Later' },
};

/** A target of at least 44 px on phones and tablets, at least 24 px at a desk (WCAG 2.2 SC 2.5.8). */
const TARGET = 'inline-flex min-h-tap items-center lg:min-h-6';

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
  const section = useDueSection();

  // The jump bar's counts, from the same queries the sections read.
  const stock = useDueStock(withinDays);
  const annual = useAnnualServiceDue();
  const prospects = useReplacementProspects();
  const reminders = useReminders(50);
  const counts = {
    'due-parts': due.data && `${due.data.items.length}${due.data.nextCursor ? '+' : ''}`,
    'stock-forecast': stock.data && String([...stock.data.replacements, ...stock.data.inspections].reduce((n, r) => n + r.count, 0)),
    'annual-services': annual.data && String(annual.data.total),
    'replacement-prospects': prospects.data && String(prospects.data.length),
    'reminders-sent': reminders.data && `${reminders.data.items.length}${reminders.data.nextCursor ? '+' : ''}`,
  };

  const filters = (
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
  );

  return (
    <Page
      wide
      title="Due list"
      subtitle="Parts and inspections coming due across all customers, from each part's age and condition."
      actions={
        <div className="no-print flex gap-2">
          <a
            className="inline-flex min-h-tap items-center rounded-plate border border-plate-line bg-plate-deep px-4 text-base font-semibold text-iron hover:bg-brass-light"
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
      <DueJumpBar current={section} counts={counts} />
      {(section === 'due-parts' || section === 'stock-forecast') && filters}

      <DueSection id="due-parts" current={section}>
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
                    <tr className="border-b-2 border-plate-line whitespace-nowrap">
                      <th className="py-2 pr-3">Due</th>
                      <th className="pr-3">Status</th>
                      <th className="pr-3">What</th>
                      <th className="pr-3">Part</th>
                      <th className="pr-3">Customer and site</th>
                      <th className="pr-3">Technician</th>
                      <th className="pr-3">Why</th>
                      {canBook && <th className="no-print pr-3">Booking</th>}
                    </tr>
                  </thead>
                  <tbody>
                    {due.data.items.map((item) => (
                      <DueRow key={item.componentId} item={item} canBook={canBook} />
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
      </DueSection>
      <DueSection id="stock-forecast" current={section}>
        <StockForecast withinDays={withinDays} />
      </DueSection>
      <DueSection id="annual-services" current={section}>
        <AnnualServiceDue />
      </DueSection>
      <DueSection id="replacement-prospects" current={section}>
        <ReplacementProspects />
      </DueSection>
      <DueSection id="reminders-sent" current={section}>
        <RemindersSent />
      </DueSection>
    </Page>
  );
}

/** One line per due part; its reason opens under it on demand (and is always printed). */
function DueRow({ item, canBook }: { item: DueItemDto; canBook: boolean }) {
  const [open, setOpen] = useState(false);
  const reasonId = useId();
  const part = `${item.typeLabel}${item.specKey ? `, ${item.specKey}` : ''}`;
  const columns = canBook ? 8 : 7;
  return (
    <>
      <tr className={`whitespace-nowrap ${open ? '' : 'border-b border-plate-line print:border-b-0'}`}>
        <td className="py-1 pr-3">{formatCalendarDate(item.dueOn)}</td>
        <td className="pr-3">
          <StatusBadge status={STATUS[item.status].look}>{STATUS[item.status].word}</StatusBadge>
        </td>
        <td className="pr-3">{item.dueKind === 'replacement' ? 'Replace' : 'Inspect'}</td>
        <td className="pr-3">
          <Link className={`${TARGET} font-semibold text-brass-dark underline`} to={`/appliances/${item.appliance.id}`}>
            {part}
          </Link>
        </td>
        <td className="max-w-[22rem] truncate pr-3" title={`${item.customer.name}, ${item.site.street}, ${item.site.town}, ${LABELS.applianceKind[item.appliance.kind]}`}>
          {item.customer.name}
          <span className="text-iron-muted">
            {' '}
            · {item.site.street}, {item.site.town} · {LABELS.applianceKind[item.appliance.kind]}
          </span>
        </td>
        <td className="pr-3">{item.site.assignedTechnicianName ?? '—'}</td>
        <td className="no-print pr-3">
          <button
            type="button"
            className={`${TARGET} gap-1 font-semibold underline`}
            aria-expanded={open}
            aria-controls={reasonId}
            onClick={() => setOpen(!open)}
          >
            {open ? 'Hide why' : 'Why'}
            <span className="sr-only"> {part} is due</span>
          </button>
        </td>
        {canBook && (
          <td className="no-print pr-3">
            <Link className={`${TARGET} font-semibold underline`} to={bookingHref({ applianceIds: [item.appliance.id], source: 'due_list' })}>
              Book<span className="sr-only"> {item.typeLabel} at {item.site.street}</span>
            </Link>
          </td>
        )}
      </tr>
      <tr id={reasonId} className={`border-b border-plate-line ${open ? '' : 'hidden print:table-row'}`}>
        <td colSpan={columns} className="pb-2 pl-3 text-sm text-iron-muted">
          {item.reason}
        </td>
      </tr>
    </>
  );
}
