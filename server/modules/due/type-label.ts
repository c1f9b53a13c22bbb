import { COMPONENT_TYPES } from '../../../shared/trade/component-types';

/** The company's own catalog label when it has one, else the generic name from shared/trade, else the code. */
export function typeLabelFor(typeCode: string, catalogLabel?: string | null): string {
  if (catalogLabel) return catalogLabel;
  return Object.hasOwn(COMPONENT_TYPES, typeCode) ? COMPONENT_TYPES[typeCode as keyof typeof COMPONENT_TYPES].label : typeCode.replaceAll('_', ' ');
}
