import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import type { CheckReport } from '#shared/schemas/checks.schema.ts';
import { api } from '@/lib/api-client.ts';
import { checkKeys } from './keys.ts';

/** POST /api/conversions/:id/checks: every rule over the current plan. It changes nothing. */
export const runChecks = (conversionId: number) =>
  api.post<CheckReport>(`/api/conversions/${conversionId}/checks`);

export const getCheckReportQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: checkKeys.report(conversionId),
    queryFn: () => runChecks(conversionId),
    // The plan changes under other pages: run again whenever a page that shows findings opens.
    staleTime: 0,
  });

export const useCheckReport = (conversionId: number) =>
  useQuery(getCheckReportQueryOptions(conversionId));

/** For pages that change the plan: the findings shown are stale, run the checks again. */
export function useInvalidateChecks(conversionId: number) {
  const queryClient = useQueryClient();
  return useCallback(
    () => queryClient.invalidateQueries({ queryKey: checkKeys.report(conversionId) }),
    [queryClient, conversionId],
  );
}
