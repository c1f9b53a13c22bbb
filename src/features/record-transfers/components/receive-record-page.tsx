import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { Page } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import type { TransferPreviewDto } from '@shared/schemas/record-transfers';
import { usePreviewTransfer } from '../api/preview-transfer';
import { useRedeemTransfer } from '../api/redeem-transfer';
import { SitePicker } from './site-picker';

const fieldError = (err: unknown, field: string) => (err instanceof ApiError ? err.details?.[field] : undefined);
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** "Receive a transferred record": the code the homeowner brought, a preview of what it copies, then the copy. */
export function ReceiveRecordPage() {
  const [code, setCode] = useState('');
  // null: a new customer and site; 'pick': an existing site, not yet picked.
  const [siteId, setSiteId] = useState<string | null>(null);
  const preview = usePreviewTransfer();
  const redeem = useRedeemTransfer();
  const shown: TransferPreviewDto | undefined = preview.data;

  return (
    <Page title="Receive a transferred record">
      <Card>
        <p className="mb-2 text-sm">
          A homeowner moving to your company can bring their boiler&apos;s life record from their old company. Ask them (or that company) for the transfer code and
          enter it here. You will see what it holds before anything is copied.
        </p>
        <form
          className="flex flex-col gap-2 sm:flex-row sm:items-end"
          onSubmit={(e) => {
            e.preventDefault();
            redeem.reset();
            preview.mutate(code);
          }}
        >
          <TextField
            label="Transfer code"
            placeholder="e.g. 7K2M-Q9XD-4HPT-WB3C"
            autoComplete="off"
            autoCapitalize="characters"
            spellCheck={false}
            className="font-mono"
            value={code}
            onChange={(e) => {
              setCode(e.target.value);
              preview.reset();
            }}
            error={fieldError(preview.error, 'code')}
          />
          <Button type="submit" disabled={preview.isPending}>
            Look up the code
          </Button>
        </form>
        {preview.error && !fieldError(preview.error, 'code') && <Notice kind="danger" title="Not looked up">{preview.error.message}</Notice>}
      </Card>

      {shown && !redeem.data && (
        <Card title="What this code copies">
          <p className="font-semibold">{shown.appliance.label}</p>
          <p>
            {shown.homeownerName} · {shown.address.street}, {shown.address.town}
          </p>
          <p className="mt-1">Recorded by {shown.senderName}.</p>
          <ul className="mt-2 list-disc pl-5" data-testid="transfer-counts">
            <li>{plural(shown.counts.visits, 'completed visit', 'completed visits')} with readings and outcomes</li>
            <li>{plural(shown.counts.components, 'part', 'parts')} on record</li>
            <li>{plural(shown.counts.partSwaps, 'part swap', 'part swaps')}</li>
            <li>{plural(shown.counts.photos, 'photo', 'photos')}</li>
          </ul>
          <p className="mt-2 text-sm">
            The copy is marked as recorded by another company. {shown.senderName} keeps its own copy and sees nothing of your records.
          </p>
          <SitePicker homeownerName={shown.homeownerName} address={shown.address} siteId={siteId} onChange={setSiteId} />
          <Button className="mt-3" disabled={redeem.isPending || siteId === 'pick'} onClick={() => redeem.mutate({ code, ...(siteId ? { siteId } : {}) })}>
            Copy this record to our company
          </Button>
          {redeem.error && (
            <Notice kind="danger" title="Not copied">
              {fieldError(redeem.error, 'code')?.[0] ?? fieldError(redeem.error, 'siteId')?.[0] ?? redeem.error.message}
            </Notice>
          )}
        </Card>
      )}

      {redeem.data && (
        <Notice kind="done" title="Record received">
          <p>
            Copied {plural(redeem.data.counts.visits, 'visit', 'visits')}, {plural(redeem.data.counts.partSwaps, 'part swap', 'part swaps')} and{' '}
            {plural(redeem.data.counts.photos, 'photo', 'photos')}.{' '}
            <Link className="font-semibold underline" to={`/appliances/${redeem.data.applianceId}`}>
              Open the life record
            </Link>
          </p>
        </Notice>
      )}
    </Page>
  );
}
