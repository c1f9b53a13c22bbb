import { api } from '@/lib/api-client';
import type { VisitDraftInput, VisitDto } from '@shared/schemas/visits';

/** Called through the draft engine, which supplies the latest state and revision; 400 has details.outcome when one is required. */
export const completeVisit = (id: string, body: VisitDraftInput) => api<VisitDto>(`/visits/${id}/complete`, { method: 'POST', body });
