import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { formatInstant } from '@shared/format/dates';
import { TRANSFER_CODE_DAYS, TRANSFER_WHAT_IS_COPIED } from '@shared/transfers/transfer-words';
import { useMakeTransferCode, useWithdrawTransferCode } from '../api/make-transfer-code';

const timeZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;

/** The homeowner's consent to move this record: a one-time code for their new heating-service company. */
export function MoveRecordCard({ applianceId, companyName }: { applianceId: string; companyName: string }) {
  const make = useMakeTransferCode(applianceId);
  const withdraw = useWithdrawTransferCode();
  const made = make.data;
  return (
    <Card title="Moving to another heating company?">
      <p className="text-sm">
        Make a code and give it to your new company. {TRANSFER_WHAT_IS_COPIED.replace('This company', companyName)} The code works once, for{' '}
        {TRANSFER_CODE_DAYS} days, and you can withdraw it until it is used.
      </p>
      {!made && (
        <Button className="mt-2" variant="secondary" disabled={make.isPending} onClick={() => make.mutate()}>
          Make a transfer code
        </Button>
      )}
      {make.error && <Notice kind="danger" title="Not made">{make.error.message}</Notice>}
      {made && (
        <div className="mt-3 rounded-plate border-2 border-ok bg-ok-soft p-3" role="status">
          <p className="text-sm font-semibold">Your transfer code (shown only now; write it down):</p>
          <p className="font-mono text-2xl font-semibold tracking-wider" data-testid="homeowner-transfer-code">
            {made.code}
          </p>
          <p className="text-sm">Works once, until {formatInstant(made.expiresAt, timeZone())}.</p>
          {withdraw.data?.status === 'withdrawn' ? (
            <p className="mt-2 font-semibold">Withdrawn: this code no longer works.</p>
          ) : (
            <Button className="mt-2" variant="ghost" disabled={withdraw.isPending} onClick={() => withdraw.mutate(made.id)}>
              Withdraw this code
            </Button>
          )}
          {withdraw.error && <p className="text-sm text-due">{withdraw.error.message}</p>}
        </div>
      )}
    </Card>
  );
}
