import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Page, Spinner } from '@/components/ui/page';
import { formatTagCode } from '@shared/tags/tag-code';
import type { SearchHit } from '@shared/schemas/records';
import { useAssignTag } from '../api/assign-tag';
import { MIN_SEARCH_LENGTH, useSearch as useApplianceSearch } from '@/lib/appliance-search';
import { useDebouncedValue } from '../lib/use-debounced-value';
import { AssignError } from './assign-error';

/** A new tag, scanned before it is on anything: find the appliance it goes on and attach it. */
export function AssignFoundTag({ code }: { code: string }) {
  const navigate = useNavigate();
  const [q, setQ] = useState('');
  const search = useApplianceSearch(useDebouncedValue(q.trim()));
  const [chosen, setChosen] = useState<SearchHit | null>(null);
  const assign = useAssignTag();

  function attach(hit: SearchHit, replaceDamaged = false) {
    assign.mutate({ code, applianceId: hit.applianceId, replaceDamaged }, { onSuccess: () => navigate(`/appliances/${hit.applianceId}`, { replace: true }) });
  }

  return (
    <Page title="Assign this tag" subtitle={`Tag ${formatTagCode(code)} is not on an appliance yet.`}>
      {chosen ? (
        <div className="flex flex-col gap-3 rounded-plate border-2 border-plate-line bg-plate-deep p-3">
          <p className="text-lg">
            Attach tag <strong className="font-mono">{formatTagCode(code)}</strong> to <strong>{chosen.applianceLabel}</strong> at {chosen.street},{' '}
            {chosen.town} ({chosen.customerName})?
          </p>
          {assign.isError && <AssignError error={assign.error} busy={assign.isPending} onReplace={() => attach(chosen, true)} />}
          <Button className="min-h-14 w-full text-xl" disabled={assign.isPending} onClick={() => attach(chosen)}>
            {assign.isPending ? 'Attaching…' : 'Attach the tag'}
          </Button>
          <Button
            variant="ghost"
            onClick={() => {
              assign.reset();
              setChosen(null);
            }}
          >
            Choose another appliance
          </Button>
        </div>
      ) : (
        <>
          <TextField
            label="Find the appliance"
            type="search"
            value={q}
            onChange={(e) => setQ(e.target.value)}
            hint="Customer name, street, phone or serial number."
            autoComplete="off"
          />
          {search.isError && <p role="alert" className="text-due">{search.error.message}</p>}
          {q.trim().length >= MIN_SEARCH_LENGTH && search.isPending && <Spinner label="Searching…" />}
          {search.data && q.trim().length >= MIN_SEARCH_LENGTH && (
            <ul className="flex flex-col gap-2" aria-label="Appliances found">
              {search.data.length === 0 && <li className="text-iron-muted">Nothing found. Try the street or the serial number.</li>}
              {search.data.map((hit) => (
                <li key={hit.applianceId}>
                  <button
                    type="button"
                    onClick={() => setChosen(hit)}
                    className="flex min-h-tap w-full flex-col items-start rounded-plate border-2 border-plate-line bg-surface p-3 text-left hover:bg-brass-light"
                  >
                    <span className="font-semibold">{hit.applianceLabel}</span>
                    <span>
                      {hit.street}, {hit.town}
                    </span>
                    <span className="text-sm text-iron-muted">
                      {hit.customerName}
                      {hit.serial ? ` · serial ${hit.serial}` : ''}
                    </span>
                  </button>
                </li>
              ))}
            </ul>
          )}
        </>
      )}
    </Page>
  );
}
