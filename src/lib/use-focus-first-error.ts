import { useEffect, useRef } from 'react';
import type { FieldErrors } from '@/lib/api-client';

/** After a failed save, moves focus to the first marked field so a long form does not hide what needs fixing. */
export function useFocusFirstError<T extends HTMLElement>(errors: FieldErrors) {
  const ref = useRef<T>(null);
  useEffect(() => {
    if (!Object.keys(errors).length) return;
    const first = ref.current?.querySelector<HTMLElement>('[aria-invalid="true"], [role="alert"]');
    first?.scrollIntoView({ block: 'center' });
    if (first?.matches('input, select, textarea')) first.focus({ preventScroll: true });
  }, [errors]);
  return ref;
}
