import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Page } from '@/components/ui/page';
import { Notice } from '@/components/ui/notice';
import type { SearchHit } from '@shared/schemas/records';
import { MIN_SEARCH_LENGTH, useSearch } from '@/lib/appliance-search';
import { useDebouncedValue } from '../hooks/use-debounced-value';

const MATCHED: Record<SearchHit['matched'], string> = { name: 'name', street: 'address', phone: 'phone', serial: 'serial' };

/** `below`: what the app puts under the search (the technician's day, from the bookings feature). */
export function FindPage({ below }: { below?: ReactNode } = {}) {
  const [text, setText] = useState('');
  const q = useDebouncedValue(text.trim(), 150);
  const search = useSearch(q);
  const tooShort = q.length < MIN_SEARCH_LENGTH;
  const hits = tooShort ? [] : (search.data ?? []);

  return (
    <Page title="Find an appliance">
      <form role="search" onSubmit={(e) => e.preventDefault()}>
        <label htmlFor="find-q" className="sr-only">
          Name, street, phone or serial
        </label>
        <input
          id="find-q"
          type="search"
          inputMode="search"
          autoComplete="off"
          autoFocus
          enterKeyHint="search"
          placeholder="Name, street, phone or serial"
          value={text}
          onChange={(e) => setText(e.target.value)}
          className="min-h-14 w-full rounded-plate border-2 border-iron bg-plate px-4 text-xl text-iron placeholder:text-iron-muted"
        />
      </form>

      <div aria-live="polite" className="flex flex-col gap-2">
        {text.trim().length < MIN_SEARCH_LENGTH && <p className="text-iron-muted">Type at least {MIN_SEARCH_LENGTH} letters or digits.</p>}
        {!tooShort && search.isError && (
          <Notice kind="danger" title="Search failed">
            {search.error.message}
          </Notice>
        )}
        {!tooShort && search.isSuccess && !search.isPlaceholderData && hits.length === 0 && (
          <p className="text-lg">Nothing found for “{q}”. Check the spelling, or try the street or the serial.</p>
        )}
        {!tooShort && search.isPending && <p role="status" className="text-iron-muted">Searching…</p>}
        {hits.length > 0 && (
          <ul className={`flex flex-col gap-2 ${search.isPlaceholderData ? 'opacity-60' : ''}`} aria-label="Results">
            {hits.map((hit) => (
              <li key={hit.applianceId}>
                <HitRow hit={hit} />
              </li>
            ))}
          </ul>
        )}
      </div>
      {below}
    </Page>
  );
}

function HitRow({ hit }: { hit: SearchHit }) {
  return (
    <Link
      to={`/appliances/${hit.applianceId}`}
      className="flex min-h-tap flex-col gap-0.5 rounded-plate border-2 border-plate-line bg-plate-deep px-4 py-3 text-iron active:border-brass"
    >
      <span className="text-lg font-bold">{hit.customerName}</span>
      <span>
        {hit.street}, {hit.town}
      </span>
      <span className="font-semibold">{hit.applianceLabel}</span>
      <span className="text-sm text-iron-muted">
        {hit.serial ? <>Serial <span className="tabular">{hit.serial}</span></> : 'No serial recorded'}
        {' · '}matched on {MATCHED[hit.matched]}
      </span>
    </Link>
  );
}
