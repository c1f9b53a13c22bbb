import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import type { Converter } from '../lib/unit-prefs';

const control = 'min-h-tap w-full rounded-plate border-2 border-plate-line bg-plate px-3 text-lg text-iron aria-[invalid=true]:border-due';

function Messages({ id, error, hint }: { id: string; error?: string[] | string; hint?: ReactNode }) {
  const messages = Array.isArray(error) ? error : error ? [error] : [];
  return (
    <>
      {hint && !messages.length && <p className="text-xs text-iron-muted">{hint}</p>}
      {messages.map((m) => (
        <p key={m} id={`${id}-error`} role="alert" className="text-sm font-semibold text-due">
          ⚠ {m}
        </p>
      ))}
    </>
  );
}

const show = (n: number | null | undefined, c: Converter) => (n == null ? '' : String(Number(c.toDisplay(n).toFixed(c.digits))));

function parse(text: string): number | null | 'bad' {
  const t = text.trim().replace(',', '.').replace('−', '-');
  if (t === '') return null;
  if (!/^-?(\d+\.?\d*|\.\d+)$/.test(t)) return 'bad';
  return Number(t);
}

/**
 * A number typed in the unit the technician chose, kept in the canonical unit. What is typed stays as typed;
 * text that is not a number gets an error beside the field and is not stored.
 */
export function NumberField({
  label,
  value,
  onChange,
  converter,
  error,
  hint,
  allowNegative = false,
  path,
  onBadText,
}: {
  label: string;
  value: number | null | undefined;
  onChange: (canonical: number | null) => void;
  converter: Converter;
  error?: string[];
  hint?: ReactNode;
  allowNegative?: boolean;
  /** The field's path in the visit ("readings.combustion.coPpm"), for jumping to it from a list of what is missing. */
  path?: string;
  /** Told the text when it is not a number (null once it is), so nothing typed is dropped unnoticed. */
  onBadText?: (text: string | null) => void;
}) {
  const id = useId();
  const reportRef = useRef(onBadText);
  useEffect(() => {
    reportRef.current = onBadText;
  });
  // Gone from the screen (a unit change re-creates the field), its text is gone too.
  useEffect(() => () => reportRef.current?.(null), []);
  const [text, setText] = useState(() => show(value, converter));
  const [bad, setBad] = useState(false);
  const [seen, setSeen] = useState(value);
  if (value !== seen) {
    // Follow outside changes (a restored or merged draft) unless the text already means this value.
    setSeen(value);
    const parsed = parse(text);
    const current = typeof parsed === 'number' ? converter.fromDisplay(parsed) : parsed;
    const same = typeof current === 'number' && typeof value === 'number' ? Math.abs(current - value) < 1e-9 : current === (value ?? null);
    if (!same && parsed !== 'bad') setText(show(value, converter));
  }

  function commit(next: string) {
    setText(next);
    const parsed = parse(next);
    setBad(parsed === 'bad');
    onBadText?.(parsed === 'bad' ? next : null);
    if (parsed !== 'bad') onChange(parsed === null ? null : converter.fromDisplay(parsed));
  }

  const errors = bad ? ['Type a number, like 8.5.'] : error;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold">
        {label} <span className="font-normal text-iron-muted">({converter.unit})</span>
      </label>
      <div className="flex gap-1">
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          value={text}
          onChange={(e) => commit(e.target.value)}
          aria-invalid={Boolean(errors?.length)}
          aria-describedby={errors?.length ? `${id}-error` : undefined}
          data-field={path}
          className={`${control} tabular`}
        />
        {allowNegative && (
          <button
            type="button"
            aria-label={`Change the sign of ${label}`}
            className="min-h-tap min-w-tap rounded-plate border-2 border-plate-line bg-plate-deep text-xl font-bold"
            onClick={() => commit(text.trim().startsWith('-') ? text.trim().slice(1) : `-${text.trim()}`)}
          >
            ±
          </button>
        )}
      </div>
      <Messages id={id} error={errors} hint={hint} />
    </div>
  );
}

export function TextInput({
  label,
  value,
  onChange,
  error,
  hint,
  field,
  ...rest
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string[];
  hint?: ReactNode;
  placeholder?: string;
  maxLength?: number;
  type?: string;
  /** The field's path in the visit, for jumping to it. */
  field?: string;
}) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      <input id={id} value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={Boolean(error?.length)} data-field={field} className={control} {...rest} />
      <Messages id={id} error={error} hint={hint} />
    </div>
  );
}

export function TextArea({
  label,
  value,
  onChange,
  error,
  rows = 3,
  maxLength = 8000,
  field,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string[];
  rows?: number;
  maxLength?: number;
  field?: string;
}) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      <textarea
        id={id}
        rows={rows}
        maxLength={maxLength}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={Boolean(error?.length)}
        data-field={field}
        className={`${control} py-2`}
      />
      <Messages id={id} error={error} />
    </div>
  );
}

type Choice<T> = { value: T; label: string; icon?: string; tone?: 'ok' | 'due' | 'plain' };

const PRESSED: Record<NonNullable<Choice<unknown>['tone']>, string> = {
  ok: 'border-ok bg-ok text-white',
  due: 'border-due bg-due text-white',
  plain: 'border-iron bg-iron text-plate',
};

/** Big side-by-side toggles; tapping the chosen one again clears it when `clearable`. */
export function ChoiceButtons<T extends string | boolean>({
  label,
  choices,
  value,
  onChange,
  clearable = false,
}: {
  label: string;
  choices: Choice<T>[];
  value: T | null | undefined;
  onChange: (v: T | null) => void;
  clearable?: boolean;
}) {
  return (
    <div role="group" aria-label={label} className="flex gap-1">
      {choices.map((c) => {
        const pressed = value === c.value;
        return (
          <button
            key={String(c.value)}
            type="button"
            aria-pressed={pressed}
            onClick={() => onChange(pressed && clearable ? null : c.value)}
            className={`min-h-tap flex-1 rounded-plate border-2 px-2 font-semibold leading-tight ${pressed ? PRESSED[c.tone ?? 'plain'] : 'border-plate-line bg-plate text-iron'}`}
          >
            {c.icon && <span aria-hidden="true">{c.icon} </span>}
            {c.label}
          </button>
        );
      })}
    </div>
  );
}

export function Panel({ title, children, id }: { title: string; children: ReactNode; id?: string }) {
  return (
    <section id={id} aria-label={title} className="flex flex-col gap-3 rounded-plate border-2 border-plate-line bg-plate-deep p-3 text-iron">
      <h2 className="text-lg font-bold">{title}</h2>
      {children}
    </section>
  );
}
