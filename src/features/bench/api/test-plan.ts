import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TestPlanResponse } from '#shared/schemas/test-plan.schema.ts';
import { api } from '@/lib/api-client.ts';
import { benchKeys } from './bench.ts';

export const getTestPlan = (conversionId: number, number: number) =>
  api.get<TestPlanResponse>(`/api/conversions/${conversionId}/revisions/${number}/test-plan`);

export const getTestPlanQueryOptions = (conversionId: number, number: number) =>
  queryOptions({
    queryKey: benchKeys.testPlan(conversionId, number),
    queryFn: () => getTestPlan(conversionId, number),
  });

export const useTestPlan = (conversionId: number, number: number) =>
  useQuery(getTestPlanQueryOptions(conversionId, number));
