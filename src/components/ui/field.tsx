import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

type FieldProps = { label: string; error?: string[] | string; hint?: ReactNode };

function FieldShell({ id, label, error, hint, children }: FieldProps & { id: string; children: ReactNode }) {
  const messages = Array.isArray(error) ? error : error ? [error] : [];
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      {children}
      {hint && !messages.length && <p className="text-xs text-iron-muted">{hint}</p>}
      {messages.map((m) => (
        <p key={m} id={`${id}-error`} role="alert" className="text-sm font-semibold text-due">
          ⚠ {m}
        </p>
      ))}
    </div>
  );
}

const control =
  'min-h-tap w-full rounded-plate border-2 border-plate-line bg-surface px-3 text-base text-iron aria-[invalid=true]:border-due';

export function TextField({ label, error, hint, ...props }: FieldProps & InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} error={error} hint={hint}>
      <input id={id} aria-invalid={Boolean(error?.length)} aria-describedby={error ? `${id}-error` : undefined} className={control} {...props} />
    </FieldShell>
  );
}

export function SelectField({ label, error, hint, children, ...props }: FieldProps & SelectHTMLAttributes<HTMLSelectElement>) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} error={error} hint={hint}>
      <select id={id} aria-invalid={Boolean(error?.length)} className={control} {...props}>
        {children}
      </select>
    </FieldShell>
  );
}

export function TextAreaField({ label, error, hint, ...props }: FieldProps & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} error={error} hint={hint}>
      <textarea id={id} aria-invalid={Boolean(error?.length)} className={`${control} py-2`} rows={3} {...props} />
    </FieldShell>
  );
}
