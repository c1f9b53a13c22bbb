import { isStorableText } from '../../shared/schemas/common';
import { FORM_ERROR_KEY } from '../../shared/schemas/errors';

type Node = { value: unknown; key: string | null; parent: Node | null };

/**
 * Dotted paths of every string (value or key) that PostgreSQL could not store, in a parsed body, query or params.
 * The schemas refuse such text field by field; this walk is the safety net for whatever a schema lets through
 * untyped, so none of it reaches a query or a jsonb column. Iterative, and a path is spelled out only when something
 * is found, so no nesting depth can overflow the stack or cost more than one step per value.
 */
export function unstorableTextPaths(root: unknown): string[] {
  const found = new Set<string>();
  const stack: Node[] = [{ value: root, key: null, parent: null }];
  while (stack.length) {
    const node = stack.pop()!;
    const { value } = node;
    if (typeof value === 'string') {
      if (!isStorableText(value)) found.add(pathOf(node));
    } else if (Array.isArray(value)) {
      value.forEach((item, i) => stack.push({ value: item, key: String(i), parent: node }));
    } else if (isPlainObject(value)) {
      for (const [key, item] of Object.entries(value)) {
        // A bad key is reported at its parent: the key itself is not fit to be echoed as a field name.
        if (!isStorableText(key)) found.add(pathOf(node));
        else stack.push({ value: item, key, parent: node });
      }
    }
  }
  return [...found];
}

function pathOf(node: Node): string {
  const keys: string[] = [];
  for (let n: Node | null = node; n?.key != null; n = n.parent) keys.push(n.key);
  return keys.reverse().join('.') || FORM_ERROR_KEY;
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  if (typeof value !== 'object' || value === null) return false;
  const proto = Object.getPrototypeOf(value);
  return proto === Object.prototype || proto === null;
}
