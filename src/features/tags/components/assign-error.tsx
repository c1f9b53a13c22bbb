import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';

export const REPLACE_EXPLAINED = 'The old tag is retired, not erased: if someone scans it later it still opens this appliance, never another.';

/** Why a tag was not attached; when the appliance already has one, offers to replace it as damaged or lost. */
export function AssignError({ error, onReplace, busy = false }: { error: Error; onReplace?: () => void; busy?: boolean }) {
  const api = error instanceof ApiError ? error : null;
  if (api?.details?.replaceDamaged && onReplace) {
    return (
      <Notice kind="caution" title="This appliance already has a tag">
        <p>{api.details.replaceDamaged[0]}</p>
        <p className="mt-1">{REPLACE_EXPLAINED}</p>
        <Button variant="secondary" className="mt-2 w-full" disabled={busy} onClick={onReplace}>
          The old tag is damaged or lost: replace it
        </Button>
      </Notice>
    );
  }
  const message =
    api?.status === 404 && api.message.startsWith('Tag')
      ? "This code is not one of your company's tags. Check it against the label."
      : api?.offline
        ? 'No connection, so the tag was not attached. Try again when you have signal.'
        : error.message;
  return (
    <Notice kind="danger" title="Tag not attached">
      {message}
    </Notice>
  );
}
