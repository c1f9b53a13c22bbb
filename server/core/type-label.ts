import { partName } from '../../shared/glossary/part-names';

/** The company's own catalog label when it has one, else the generic name, else the code made readable (the glossary's rule). */
export const typeLabelFor = (typeCode: string, catalogLabel?: string | null): string => partName(typeCode, catalogLabel);
