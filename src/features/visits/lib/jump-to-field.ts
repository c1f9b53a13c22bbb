const FOCUSABLE = 'input, textarea, select, button';

/** The element marked for a field path, or for the nearest enclosing path ("readings.combustion" for "readings.combustion.o2Pct"). */
function targetFor(path: string): HTMLElement | null {
  const candidates = [path];
  // A skip reason not yet opened sits with its reading.
  if (path.startsWith('readingSkips.')) candidates.push(`readings.${path.slice('readingSkips.'.length)}`);
  for (const start of candidates) {
    for (let p = start; p; p = p.includes('.') ? p.slice(0, p.lastIndexOf('.')) : '') {
      const el = document.querySelector<HTMLElement>(`[data-field="${CSS.escape(p)}"]`);
      if (el) return el;
    }
  }
  return null;
}

/** Scrolls a missing field into view and puts the cursor (or the first control) there. */
export function jumpToField(path: string): boolean {
  const el = targetFor(path);
  if (!el) return false;
  el.scrollIntoView({ block: 'center' });
  const control = el.matches(FOCUSABLE) ? el : el.querySelector<HTMLElement>(FOCUSABLE);
  control?.focus({ preventScroll: true });
  return true;
}
