import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { StatusBadge } from '@/components/ui/status-badge';
import { formatInstant } from '@shared/format/dates';
import { TRANSFER_CODE_DAYS, TRANSFER_WHAT_IS_COPIED } from '@shared/transfers/transfer-words';
import { useCreateRecordTransfer, useRecordTransfers, useWithdrawRecordTransfer } from '../api/record-transfers';
import { Section } from './section';
import { RECORD_SECTIONS } from '@shared/glossary';

const STATUS = { open: ['ok', 'Open'], used: ['info', 'Used'], withdrawn: ['info', 'Withdrawn'], expired: ['info', 'Expired'] } as const;

/** "Transfer to another company": a one-time code the homeowner hands to their new company; shown once, when made. */
export function RecordTransferSection({ applianceId, timeZone }: { applianceId: string; timeZone: string }) {
  const transfers = useRecordTransfers(applianceId);
  const create = useCreateRecordTransfer(applianceId);
  const withdraw = useWithdrawRecordTransfer(applianceId);
  return (
    <Section title={RECORD_SECTIONS.transfer}>
      <p className="mb-2 text-sm">
        When the homeowner moves to another heating-service company, make a code at their request and give it to them. {TRANSFER_WHAT_IS_COPIED} The code
        works once, for {TRANSFER_CODE_DAYS} days.
      </p>
      <Button variant="secondary" disabled={create.isPending} onClick={() => create.mutate()}>
        Make a transfer code
      </Button>
      {create.error && <Notice kind="danger" title="Not made">{create.error.message}</Notice>}
      {create.data && (
        <div className="mt-3 rounded-plate border-2 border-ok bg-ok-soft p-3" role="status">
          <p className="text-sm font-semibold">Transfer code (shown once; write it down or copy it now):</p>
          <p className="font-mono text-2xl font-semibold tracking-wider tabular-nums" data-testid="new-transfer-code">
            {create.data.code}
          </p>
          <p className="text-sm">Works once, until {formatInstant(create.data.expiresAt, timeZone)}.</p>
        </div>
      )}
      {transfers.data && transfers.data.length > 0 && (
        <ul className="mt-3 flex flex-col gap-2">
          {transfers.data.map((t) => (
            <li key={t.id} className="flex flex-wrap items-center gap-2 border-b border-plate-line pb-2 text-sm">
              <StatusBadge status={STATUS[t.status][0]}>{STATUS[t.status][1]}</StatusBadge>
              <span>Code made {formatInstant(t.createdAt, timeZone)}</span>
              {t.status === 'open' && (
                <Button variant="ghost" className="ml-auto" disabled={withdraw.isPending} onClick={() => withdraw.mutate(t.id)}>
                  Withdraw code
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}
