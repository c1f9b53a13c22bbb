import { api } from '@/lib/api-client';
import type { VisitDraftInput, VisitDto } from '@shared/schemas/visits';

/** Autosave; the server refuses a stale revision with 409 (see draft/draft-sync.ts for what happens then). */
export const saveVisitDraft = (id: string, body: VisitDraftInput) => api<VisitDto>(`/visits/${id}/draft`, { method: 'PUT', body });
