import { COMPONENT_TYPES, formatSpec, type ComponentType, type SpecField } from '../trade/component-types';

/**
 * Reads a spreadsheet's "size or spec" cell ("24 in", "0.85 gph, 80°, hollow", "12 in, dia. 5/8 in") into the part
 * type's spec fields. Returns null when the text cannot be read that way; the importer then keeps it word for word as
 * the part's description, so nothing in the file is lost.
 */
export function parseSpecText(type: ComponentType, text: string): Record<string, string | number> | null {
  const fields: readonly SpecField[] = COMPONENT_TYPES[type].specFields;
  const pieces = text
    .split(/[,;]/)
    .map((p) => p.trim())
    .filter(Boolean);
  if (!pieces.length) return {};
  const spec: Record<string, string | number> = {};
  for (const piece of pieces) {
    const field = fields.find((f) => spec[f.key] === undefined && fits(f, piece));
    if (!field) return null;
    spec[field.key] = field.kind === 'choice' ? choiceOf(field, piece)! : numberOf(piece)!;
  }
  try {
    formatSpec(type, spec);
  } catch {
    return null;
  }
  return spec;
}

const UNIT_WORDS: Record<string, RegExp> = {
  in: /^(?:dia\.?\s*|inlet\s*)?[\d./\s-]+\s*(?:in|inch|inches|")$/i,
  psi: /^[\d.]+\s*psi[g]?$/i,
  gph: /^[\d.]+\s*gph$/i,
  deg: /^[\d.]+\s*(?:°|deg|degrees?)$/i,
  degF: /^[\d.]+\s*(?:°\s*F|F|deg\s*F)$/i,
  gal: /^[\d.]+\s*(?:gal|gallons?)$/i,
  V: /^[\d.]+\s*(?:V|volts?)$/i,
  btu_per_hour: /^[\d,.]+\s*(?:btu\/?h|btuh)$/i,
};

function fits(field: SpecField, piece: string): boolean {
  if (field.kind === 'choice') return choiceOf(field, piece) !== null;
  if (!UNIT_WORDS[field.unit]?.test(piece)) return false;
  // "dia. 5/8 in" goes only to a diameter, "inlet 3/4 in" only to an inlet size; a bare "5/8 in" to the next free one.
  const prefix = /^(dia|inlet)/i.exec(piece)?.[1]?.toLowerCase();
  if (prefix && !field.prefix?.toLowerCase().startsWith(prefix)) return false;
  return numberOf(piece) !== null;
}

function choiceOf(field: Extract<SpecField, { kind: 'choice' }>, piece: string): string | null {
  const lower = piece.toLowerCase();
  const hit = Object.entries(field.options).find(([code, label]) => lower === label.toLowerCase() || lower === code.replace(/_/g, ' '));
  return hit ? hit[0] : null;
}

/** "5/8 in" → 0.625, "1 1/4 in" → 1.25, "0.85 gph" → 0.85. */
function numberOf(piece: string): number | null {
  const text = piece.replace(/,(?=\d{3})/g, '');
  const mixed = /(\d+)[\s-]+(\d+)\/(\d+)/.exec(text);
  const fraction = /(\d+)\/(\d+)/.exec(text);
  const decimal = /\d+(?:\.\d+)?/.exec(text);
  const value = mixed
    ? Number(mixed[1]) + Number(mixed[2]) / Number(mixed[3])
    : fraction
      ? Number(fraction[1]) / Number(fraction[2])
      : decimal
        ? Number(decimal[0])
        : NaN;
  return Number.isFinite(value) && value > 0 ? value : null;
}
