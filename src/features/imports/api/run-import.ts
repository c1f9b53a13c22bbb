import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ImportMapping } from '@shared/imports/import-fields';
import type { ImportFileDto } from '@shared/schemas/imports';
import { importKeys } from './list-imports';

export const runImport = ({ id, mapping }: { id: string; mapping: ImportMapping }) =>
  api<ImportFileDto>(`/imports/${encodeURIComponent(id)}/run`, { method: 'POST', body: { mapping } });

export function useRunImport() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: runImport,
    onSuccess: (file) => {
      qc.setQueryData(importKeys.one(file.id), file);
      // Customers, records and the due list all change with an import.
      void qc.invalidateQueries();
    },
  });
}

export const errorsCsvUrl = (id: string) => `/api/imports/${encodeURIComponent(id)}/errors.csv`;
