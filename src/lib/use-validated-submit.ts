import { useState } from 'react';
import type { z } from 'zod';
import type { FieldErrors } from './api-client';
import { describeFailure, zodFieldErrors } from './form-errors';
import { useFocusFirstError } from './use-focus-first-error';

/**
 * A form's submit path: check with the shared zod schema, send, and on any failure keep the field errors and one
 * sentence for the rest. The form's own draft is never touched, so nothing typed is lost.
 */
export function useValidatedSubmit<S extends z.ZodType>(schema: S, send: (value: z.output<S>) => Promise<unknown>) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const formRef = useFocusFirstError<HTMLFormElement>(errors);

  async function submit(input: unknown) {
    setFailure(null);
    const parsed = schema.safeParse(input);
    if (!parsed.success) {
      setErrors(zodFieldErrors(parsed.error));
      return;
    }
    setErrors({});
    setSaving(true);
    try {
      await send(parsed.data);
    } catch (err) {
      const { fields, message } = describeFailure(err);
      setErrors(fields);
      setFailure(message);
    } finally {
      setSaving(false);
    }
  }

  return { errors, failure, saving, formRef, submit };
}
