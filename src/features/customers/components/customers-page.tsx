import { useEffect, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { CustomerListItem } from '@shared/schemas/records';
import { can } from '@shared/policy';
import { Page, Spinner } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { useMe } from '@/lib/auth';
import { useCustomers, type CustomerSort } from '../api/list-customers';

const PAGE_SIZE = 25;
const SORTS: Record<CustomerSort, string> = { name: 'Name, A to Z', town: 'Town, A to Z', created: 'Newest first' };
const isSort = (v: string | null): v is CustomerSort => v !== null && v in SORTS;

export function CustomersPage() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const q = params.get('q') ?? '';
  const sortParam = params.get('sort');
  const sort: CustomerSort = isSort(sortParam) ? sortParam : 'name';
  const [typed, setTyped] = useState(q);
  // The address can change without typing (Back, a link): the box follows it.
  const [seenQ, setSeenQ] = useState(q);
  if (q !== seenQ) {
    setSeenQ(q);
    if (typed.trim() !== q) setTyped(q);
  }
  // Keyset paging: each "Next page" pushes the server's cursor; "Previous page" pops it. No offsets.
  // The stack belongs to one filter and sort; any other (typed, chosen, or reached with Back) starts at page 1.
  const listKey = `${sort}|${q}`;
  const [paging, setPaging] = useState<{ listKey: string; cursors: string[] }>({ listKey, cursors: [] });
  const cursors = paging.listKey === listKey ? paging.cursors : [];
  const setCursors = (update: (c: string[]) => string[]) => setPaging({ listKey, cursors: update(cursors) });
  const after = cursors.at(-1);
  const list = useCustomers({ q: q || undefined, sort, after, limit: PAGE_SIZE });

  useEffect(() => {
    if (typed.trim() === q) return;
    const timer = setTimeout(() => {
      setParams((p) => {
        const next = new URLSearchParams(p);
        if (typed.trim()) next.set('q', typed.trim());
        else next.delete('q');
        return next;
      }, { replace: true });
    }, 250);
    return () => clearTimeout(timer);
  }, [typed, q, setParams]);

  function changeSort(value: CustomerSort) {
    setParams((p) => {
      const next = new URLSearchParams(p);
      next.set('sort', value);
      return next;
    }, { replace: true });
  }

  const items = list.data?.items ?? [];
  const nextCursor = list.data?.nextCursor ?? null;
  const pageNumber = cursors.length + 1;

  return (
    <Page
      title="Customers"
      subtitle="Everyone whose heating you look after."
      actions={
        can(me.data?.principal, 'records:write') && (
          <Link to="/customers/new" className="inline-flex min-h-tap items-center rounded-plate bg-iron px-4 font-semibold text-plate hover:bg-iron-soft">
            + New customer
          </Link>
        )
      }
    >
      <div className="flex flex-col gap-3 sm:flex-row sm:items-end">
        <div className="flex-1">
          <TextField
            label="Filter"
            type="search"
            placeholder="Name, phone or e-mail"
            value={typed}
            onChange={(e) => setTyped(e.target.value)}
          />
        </div>
        <div className="sm:w-56">
          <SelectField label="Sort by" value={sort} onChange={(e) => changeSort(e.target.value as CustomerSort)}>
            {Object.entries(SORTS).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </SelectField>
        </div>
      </div>

      {list.isError && <Notice kind="danger" title="Could not load customers">{list.error.message}</Notice>}
      {list.isPending ? (
        <Spinner />
      ) : items.length === 0 ? (
        <Card>
          <p>{q ? `No customer matches "${q}".` : 'No customers yet. Add the first one with "New customer".'}</p>
        </Card>
      ) : (
        <>
          <CustomerTable items={items} sort={sort} onSort={changeSort} busy={list.isPlaceholderData} />
          <CustomerCards items={items} />
        </>
      )}

      <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-2">
        <Button variant="secondary" disabled={cursors.length === 0} onClick={() => setCursors((c) => c.slice(0, -1))}>
          ← Previous page
        </Button>
        <span className="text-sm text-iron-muted" aria-live="polite">
          Page {pageNumber}
        </span>
        <Button variant="secondary" disabled={!nextCursor || list.isPlaceholderData} onClick={() => nextCursor && setCursors((c) => [...c, nextCursor])}>
          Next page →
        </Button>
      </nav>
    </Page>
  );
}

function SortHeader({ label, value, sort, onSort }: { label: string; value: CustomerSort; sort: CustomerSort; onSort: (s: CustomerSort) => void }) {
  const active = sort === value;
  return (
    <th scope="col" aria-sort={active ? 'ascending' : 'none'} className="px-3 py-2">
      <button type="button" onClick={() => onSort(value)} className="inline-flex min-h-tap items-center gap-1 font-semibold underline-offset-2 hover:underline">
        {label}
        <span aria-hidden="true">{active ? '▲' : '↕'}</span>
        <span className="sr-only">{active ? '(sorted A to Z)' : '(sort by this)'}</span>
      </button>
    </th>
  );
}

function CustomerTable({ items, sort, onSort, busy }: { items: CustomerListItem[]; sort: CustomerSort; onSort: (s: CustomerSort) => void; busy: boolean }) {
  return (
    <div className="hidden overflow-x-auto rounded-plate border border-plate-line bg-surface md:block">
      <table className={`w-full text-left ${busy ? 'opacity-60' : ''}`} aria-busy={busy}>
        <caption className="sr-only">Customers</caption>
        <thead className="border-b-2 border-plate-line bg-plate-deep text-sm">
          <tr>
            <SortHeader label="Name" value="name" sort={sort} onSort={onSort} />
            <SortHeader label="Town" value="town" sort={sort} onSort={onSort} />
            <th scope="col" className="px-3 py-2 text-right">Sites</th>
            <th scope="col" className="px-3 py-2 text-right">Appliances</th>
            <th scope="col" className="px-3 py-2">Phone</th>
            <th scope="col" className="px-3 py-2">E-mail</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-plate-line">
          {items.map((c) => (
            <tr key={c.id} className="hover:bg-plate">
              <td className="px-3 py-2">
                <Link to={`/customers/${c.id}`} className="font-semibold underline underline-offset-2">
                  {c.name}
                </Link>
              </td>
              <td className="px-3 py-2">{c.firstTown ?? '—'}</td>
              <td className="tabular px-3 py-2 text-right">{c.siteCount}</td>
              <td className="tabular px-3 py-2 text-right">{c.applianceCount}</td>
              <td className="px-3 py-2">{c.phone ? <a href={`tel:${c.phone}`}>{c.phone}</a> : '—'}</td>
              <td className="px-3 py-2">{c.email ? <a href={`mailto:${c.email}`} className="break-all">{c.email}</a> : '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function CustomerCards({ items }: { items: CustomerListItem[] }) {
  return (
    <ul className="flex flex-col gap-2 md:hidden" aria-label="Customers">
      {items.map((c) => (
        <li key={c.id} className="rounded-plate border border-plate-line bg-surface p-3">
          <Link to={`/customers/${c.id}`} className="flex min-h-tap items-center text-lg font-semibold underline underline-offset-2">
            {c.name}
          </Link>
          <p className="text-iron-muted">
            {c.firstTown ?? 'No site yet'} · {c.siteCount} {c.siteCount === 1 ? 'site' : 'sites'} · {c.applianceCount}{' '}
            {c.applianceCount === 1 ? 'appliance' : 'appliances'}
          </p>
          <div className="mt-1 flex flex-wrap gap-x-4">
            {c.phone && (
              <a href={`tel:${c.phone}`} className="flex min-h-tap items-center font-semibold">
                ☎ {c.phone}
              </a>
            )}
            {c.email && (
              <a href={`mailto:${c.email}`} className="flex min-h-tap items-center break-all">
                ✉ {c.email}
              </a>
            )}
          </div>
        </li>
      ))}
    </ul>
  );
}
