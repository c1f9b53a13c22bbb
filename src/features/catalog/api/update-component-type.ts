import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { CatalogEntryDto, catalogPatch } from '@shared/schemas/records';
import { componentTypeKeys } from '@/lib/resources/component-types';

export type CatalogPatchBody = z.output<typeof catalogPatch>;

export const updateComponentType = ({ code, body }: { code: string; body: CatalogPatchBody }) =>
  api<CatalogEntryDto>(`/catalog/component-types/${encodeURIComponent(code)}`, { method: 'PATCH', body });

export function useUpdateComponentType() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateComponentType,
    onSuccess: () => qc.invalidateQueries({ queryKey: componentTypeKeys.all }),
  });
}
