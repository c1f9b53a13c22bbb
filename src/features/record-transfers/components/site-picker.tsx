import { useState } from 'react';
import { TextField } from '@/components/ui/field';
import { useCustomerMatches, useCustomerSites } from '../api/find-sites';

type Props = {
  homeownerName: string;
  address: { street: string; town: string };
  siteId: string | null;
  /** A site id, null for a new customer and site, or 'pick' while an existing site is still to be chosen. */
  onChange: (siteId: string | null) => void;
};

/** Where the copy is filed: a new customer and site from the record (the default), or a site the company already has. */
export function SitePicker({ homeownerName, address, siteId, onChange }: Props) {
  const [existing, setExisting] = useState(false);
  const [q, setQ] = useState(homeownerName);
  const [customerId, setCustomerId] = useState<string | null>(null);
  const matches = useCustomerMatches(existing ? q : '');
  const sites = useCustomerSites(existing ? customerId : null);
  return (
    <fieldset className="mt-3 flex flex-col gap-1">
      <legend className="font-semibold">File it under</legend>
      <label className="flex min-h-tap items-center gap-2">
        <input
          type="radio"
          name="file-under"
          checked={!existing}
          onChange={() => {
            setExisting(false);
            onChange(null);
          }}
        />
        A new customer: {homeownerName}, {address.street}, {address.town}
      </label>
      <label className="flex min-h-tap items-center gap-2">
        <input
          type="radio"
          name="file-under"
          checked={existing}
          onChange={() => {
            setExisting(true);
            onChange('pick');
          }}
        />
        One of our customers already on record
      </label>
      {existing && (
        <div className="ml-6 flex flex-col gap-2">
          <TextField label="Customer name" value={q} onChange={(e) => setQ(e.target.value)} />
          <ul className="flex flex-col gap-1">
            {matches.data?.items.map((c) => (
              <li key={c.id}>
                <label className="flex min-h-tap items-center gap-2">
                  <input type="radio" name="customer" checked={customerId === c.id} onChange={() => {
                      setCustomerId(c.id);
                      onChange('pick');
                    }} />
                  {c.name}
                  {c.firstTown ? ` · ${c.firstTown}` : ''}
                </label>
              </li>
            ))}
            {matches.data && !matches.data.items.length && <li className="text-sm">No customer of ours has this name.</li>}
          </ul>
          {sites.data && (
            <ul className="flex flex-col gap-1">
              {sites.data.sites.map((s) => (
                <li key={s.id}>
                  <label className="flex min-h-tap items-center gap-2">
                    <input type="radio" name="site" checked={siteId === s.id} onChange={() => onChange(s.id)} />
                    {s.street}, {s.town}
                  </label>
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </fieldset>
  );
}
