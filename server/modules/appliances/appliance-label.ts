import { LABELS, type ApplianceKind, type Fuel } from '../../../shared/schemas/enums';

/** "Harrowgate Foundry HF-4 · steam boiler, natural gas": make and model when known, always kind and fuel. */
export function applianceLabel(a: { kind: ApplianceKind; fuel: Fuel; manufacturer?: string | null; model?: string | null }): string {
  const what = `${LABELS.applianceKind[a.kind].toLowerCase()}, ${LABELS.fuel[a.fuel].toLowerCase()}`;
  const make = [a.manufacturer, a.model].filter(Boolean).join(' ');
  return make ? `${make} · ${what}` : what.charAt(0).toUpperCase() + what.slice(1);
}
