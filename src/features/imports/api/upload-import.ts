import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ImportFileDto } from '@shared/schemas/imports';
import { importKeys } from './list-imports';

export function uploadImport(file: File) {
  const form = new FormData();
  form.append('file', file, file.name);
  return api<ImportFileDto>('/imports', { method: 'POST', body: form });
}

export function useUploadImport() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: uploadImport,
    onSuccess: (file) => {
      qc.setQueryData(importKeys.one(file.id), file);
      void qc.invalidateQueries({ queryKey: importKeys.all, exact: true });
    },
  });
}
