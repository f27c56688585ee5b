import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CircuitCalcResult } from '#shared/domain/electrical/circuit-calc.ts';
import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import { api } from '@/lib/api-client.ts';
import { useDebouncedValue } from '../hooks/use-debounced-value.ts';
import { calcKeys } from './keys.ts';

/** POST /api/calc/run: one load on one run of wire, with its working and sources. It changes nothing. */
export const runCalc = (input: CalcRequestInput, signal?: AbortSignal) =>
  api.post<CircuitCalcResult>('/api/calc/run', input, { signal });

/** An answer with the inputs it answers, so a result kept on screen is never shown beside newer inputs. */
export interface CalcRun {
  input: CalcRequestInput;
  result: CircuitCalcResult;
}

export const getCalcRunQueryOptions = (input: CalcRequestInput) =>
  queryOptions({
    queryKey: calcKeys.run(input),
    // A request for inputs that changed meanwhile is aborted on the network too.
    queryFn: async ({ signal }): Promise<CalcRun> => ({
      input,
      result: await runCalc(input, signal),
    }),
    // The same inputs always give the same answer.
    staleTime: Infinity,
    gcTime: 5 * 60_000,
  });

/** How long typing must pause before the calculator is asked. */
const CALC_DEBOUNCE_MS = 300;

/**
 * Live results while inputs change: asks once typing pauses, keyed by the inputs, so an answer to
 * inputs already changed is never shown; the last answer stays on screen (marked stale) meanwhile.
 */
export function useCalcRun(input: CalcRequestInput | null) {
  const settled = useDebouncedValue(input, CALC_DEBOUNCE_MS);
  const query = useQuery({
    ...getCalcRunQueryOptions(settled ?? ({} as CalcRequestInput)),
    enabled: settled !== null,
    placeholderData: keepPreviousData,
  });
  const waiting = input !== null && JSON.stringify(input) !== JSON.stringify(settled);
  return { ...query, stale: waiting || query.isPlaceholderData || query.isFetching };
}
