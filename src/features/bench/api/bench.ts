import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  BenchItem,
  BenchRecord,
  BenchRecordRequest,
  BenchSheet,
} from '#shared/schemas/bench.schema.ts';
import { api } from '@/lib/api-client.ts';

export const benchKeys = {
  all: ['bench'] as const,
  sheet: (conversionId: number) => [...benchKeys.all, conversionId] as const,
};

export const getBenchSheet = (conversionId: number) =>
  api.get<BenchSheet>(`/api/conversions/${conversionId}/bench`);

export const getBenchSheetQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: benchKeys.sheet(conversionId),
    queryFn: () => getBenchSheet(conversionId),
  });

export const useBenchSheet = (conversionId: number) =>
  useQuery(getBenchSheetQueryOptions(conversionId));

/** The sheet with one pin's item changed; the cache may not hold a sheet yet. */
function updateItem(
  sheet: BenchSheet | undefined,
  pinId: number,
  update: (item: BenchItem) => BenchItem,
): BenchSheet | undefined {
  return sheet
    ? { ...sheet, items: sheet.items.map((i) => (i.pin.id === pinId ? update(i) : i)) }
    : sheet;
}

interface RecordInput {
  revisionNumber: number;
  pinId: number;
  change: Omit<BenchRecordRequest, 'version'>;
}

/**
 * Records one pin's bench work. Optimistic: the tick shows at once and rolls back with a message if
 * the server refuses. Per-pin scope, and the version read when the request runs, so quick taps on
 * one pin never trip over each other.
 */
export function useRecordBenchWork(conversionId: number) {
  const queryClient = useQueryClient();
  const key = benchKeys.sheet(conversionId);
  return useMutation({
    mutationFn: ({ revisionNumber, pinId, change }: RecordInput) => {
      const sheet = queryClient.getQueryData<BenchSheet>(key);
      // The optimistic copy of a first record carries version −1: the server has none yet.
      const read = sheet?.items.find((i) => i.pin.id === pinId)?.record?.version;
      const version = read == null || read < 0 ? null : read;
      return api
        .put<{ record: BenchRecord }>(
          `/api/conversions/${conversionId}/revisions/${revisionNumber}/bench/${pinId}`,
          { ...change, version },
        )
        .then((r) => r.record);
    },
    onMutate: async ({ pinId, change }) => {
      await queryClient.cancelQueries({ queryKey: key });
      const previous = queryClient.getQueryData<BenchSheet>(key);
      queryClient.setQueryData<BenchSheet>(key, (sheet) =>
        updateItem(sheet, pinId, (i) => ({
          ...i,
          record: {
            ...(i.record ?? { pinId, recordedBy: '', recordedAt: '', version: -1 }),
            ...change,
          },
        })),
      );
      return { previous };
    },
    onError: (_err, _input, context) => {
      if (context?.previous) queryClient.setQueryData(key, context.previous);
    },
    onSuccess: (record) => {
      queryClient.setQueryData<BenchSheet>(key, (sheet) =>
        updateItem(sheet, record.pinId, (i) => ({ ...i, record })),
      );
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: key }),
    scope: { id: `bench-${conversionId}` },
  });
}
