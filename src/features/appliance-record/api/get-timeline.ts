import { useInfiniteQuery } from '@tanstack/react-query';
import type { TimelineKind } from '@shared/schemas/enums';
import { timelineQueryOptions } from '@/lib/resources/appliances';

export const useTimeline = (id: string, kind?: TimelineKind) => useInfiniteQuery(timelineQueryOptions(id, kind));
