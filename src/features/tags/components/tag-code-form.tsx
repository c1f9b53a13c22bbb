import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { checkTagCode, normalizeTagCode, TAG_BODY_LENGTH } from '@shared/tags/tag-code';

const CODE_LENGTH = TAG_BODY_LENGTH + 1;

/**
 * A tag code typed from the label. The check character catches a slip before anything is sent; the reason
 * shows once the code is long enough (or a character that never appears in a code is typed), not on every key.
 */
export function TagCodeForm({
  label = 'Tag code',
  submitLabel,
  busy = false,
  serverError,
  onSubmit,
}: {
  label?: string;
  submitLabel: string;
  busy?: boolean;
  serverError?: string[];
  onSubmit: (code: string) => void;
}) {
  const [value, setValue] = useState('');
  const [tried, setTried] = useState(false);
  const check = checkTagCode(value);
  const typed = normalizeTagCode(value);
  const showReason = !check.ok && value.trim() !== '' && (tried || typed.length >= CODE_LENGTH || !check.reason.startsWith('A tag code has'));
  const error = showReason && !check.ok ? [check.reason] : serverError;

  function submit(e: FormEvent) {
    e.preventDefault();
    setTried(true);
    if (check.ok) onSubmit(check.code);
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-2">
      <TextField
        label={label}
        value={value}
        onChange={(e) => setValue(e.target.value)}
        error={tried && value.trim() === '' ? ['Enter the code printed under the QR.'] : error}
        hint="8 characters under the QR, e.g. WF3K-9X2Q. Dashes and spaces do not matter."
        autoCapitalize="characters"
        autoComplete="off"
        autoCorrect="off"
        spellCheck={false}
        inputMode="text"
        className="min-h-tap w-full rounded-plate border-2 border-plate-line bg-surface px-3 font-mono text-lg tracking-widest text-iron uppercase aria-[invalid=true]:border-due"
      />
      <Button type="submit" disabled={busy}>
        {busy ? 'Working…' : submitLabel}
      </Button>
    </form>
  );
}
