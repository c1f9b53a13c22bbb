import { useId, type InputHTMLAttributes, type ReactNode } from 'react';

export function CheckboxField({ label, hint, error, ...props }: { label: ReactNode; hint?: ReactNode; error?: string[] } & InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="flex min-h-tap cursor-pointer items-center gap-3">
        <input id={id} type="checkbox" className="h-5 w-5 shrink-0 accent-iron" aria-invalid={Boolean(error?.length)} {...props} />
        <span className="font-semibold">{label}</span>
      </label>
      {hint && !error?.length && <p className="text-xs text-iron-muted">{hint}</p>}
      {error?.map((m) => (
        <p key={m} role="alert" className="text-sm font-semibold text-due">
          ⚠ {m}
        </p>
      ))}
    </div>
  );
}
