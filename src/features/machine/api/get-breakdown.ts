import { keepPreviousData, useInfiniteQuery } from '@tanstack/react-query';
import { breakdownPageView, type BreakdownPageView, type BreakdownQuery } from '@domain/contracts/machine.ts';
import { api } from '../../../lib/api.ts';
import { parseResponse } from '../../../lib/parse.ts';
import { machineKeys, machinePath } from './keys.ts';

export type BreakdownFilters = Partial<Omit<BreakdownQuery, 'offset' | 'limit'>>;

/** Lines per request: the table asks for the next page as the person scrolls near the end. */
export const BREAKDOWN_PAGE = 1000;

/** `GET …/machine/breakdown?offset&limit&…` → one page of lines (filtered and sorted on the server) and all assemblies. */
export async function getBreakdownPage(productionId: string, filters: BreakdownFilters, offset: number, limit = BREAKDOWN_PAGE): Promise<BreakdownPageView> {
  const params = new URLSearchParams({ offset: String(offset), limit: String(limit) });
  for (const [k, v] of Object.entries(filters)) if (v !== undefined && v !== '') params.set(k, String(v));
  return parseResponse(breakdownPageView, await api.get(machinePath(productionId, `/breakdown?${params}`)), 'the breakdown');
}

export function useBreakdown(productionId: string, filters: BreakdownFilters) {
  return useInfiniteQuery({
    queryKey: machineKeys.breakdown(productionId, filters),
    queryFn: ({ pageParam }) => getBreakdownPage(productionId, filters, pageParam),
    initialPageParam: 0,
    getNextPageParam: (last) => (last.offset + last.lines.length < last.total ? last.offset + last.lines.length : undefined),
    placeholderData: keepPreviousData,
  });
}
