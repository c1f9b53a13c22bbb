import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ImportMapping } from '@shared/imports/import-fields';
import type { ImportPreviewDto } from '@shared/schemas/imports';

export const previewImport = ({ id, mapping }: { id: string; mapping: ImportMapping }) =>
  api<ImportPreviewDto>(`/imports/${encodeURIComponent(id)}/preview`, { method: 'POST', body: { mapping } });

export const usePreviewImport = () => useMutation({ mutationFn: previewImport });
