import {
  queryOptions,
  useMutation,
  useMutationState,
  useQuery,
  useQueryClient,
  type QueryClient,
} from '@tanstack/react-query';
import type {
  BenchItem,
  BenchRecord,
  BenchRecordRequest,
  BenchSheet,
} from '#shared/schemas/bench.schema.ts';
import { ApiError, api } from '@/lib/api-client.ts';

export const benchKeys = {
  all: ['bench'] as const,
  sheet: (conversionId: number) => [...benchKeys.all, conversionId] as const,
  revisionSheet: (conversionId: number, number: number) =>
    [...benchKeys.all, conversionId, 'revision', number] as const,
  testPlan: (conversionId: number, number: number) =>
    [...benchKeys.all, conversionId, 'test-plan', number] as const,
};

/** The key every bench write shares, so queued writes can be counted, persisted and resumed. */
export const RECORD_BENCH_WORK = ['bench', 'record'] as const;

export const getBenchSheet = (conversionId: number) =>
  api.get<BenchSheet>(`/api/conversions/${conversionId}/bench`);

export const getBenchSheetQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: benchKeys.sheet(conversionId),
    queryFn: () => getBenchSheet(conversionId),
  });

export const useBenchSheet = (conversionId: number) =>
  useQuery(getBenchSheetQueryOptions(conversionId));

/** The checklist of one signed-off revision, as it stands (an older one stays readable). */
export const getRevisionBenchSheetQueryOptions = (conversionId: number, number: number) =>
  queryOptions({
    queryKey: benchKeys.revisionSheet(conversionId, number),
    queryFn: () =>
      api.get<BenchSheet>(`/api/conversions/${conversionId}/revisions/${number}/bench`),
  });

export const useRevisionBenchSheet = (conversionId: number, number: number, enabled = true) =>
  useQuery({ ...getRevisionBenchSheetQueryOptions(conversionId, number), enabled });

export const benchPhotoHref = (photoId: number) => `/api/bench-photos/${photoId}`;

/** Everything a queued write needs, stored with it so it can be sent after a reload. */
export interface RecordBenchWorkInput {
  conversionId: number;
  revisionNumber: number;
  key: string;
  /** What the technician saw on screen, for the sheet and the conflict message. */
  name: string;
  change: Omit<BenchRecordRequest, 'version'>;
  /** The record's version when the tick was made; null for an item without a record yet. */
  baseVersion: number | null;
}

/**
 * Versions our own queued writes produced: a second tick on the same item, queued while offline,
 * was made against the result of the first and so carries on from the version the first one got.
 * Anyone else's change in between still answers 409.
 */
const ownVersions = new Map<string, number>();
const chainKey = (input: RecordBenchWorkInput, version: number | null) =>
  `${input.conversionId}/${input.revisionNumber}/${input.key}@${version ?? 'new'}`;

function versionToSend(input: RecordBenchWorkInput): number | null {
  let version = input.baseVersion;
  for (let seen = 0; seen < 1000 && ownVersions.has(chainKey(input, version)); seen += 1) {
    version = ownVersions.get(chainKey(input, version))!;
  }
  return version;
}

export function sendBenchWork(input: RecordBenchWorkInput): Promise<BenchRecord> {
  const version = versionToSend(input);
  return api
    .put<{ record: BenchRecord }>(
      `/api/conversions/${input.conversionId}/revisions/${input.revisionNumber}/bench/${encodeURIComponent(input.key)}`,
      { ...input.change, version },
    )
    .then((r) => {
      ownVersions.set(chainKey(input, version), r.record.version);
      return r.record;
    });
}

/** The sheet with one item's record changed, wherever the item is listed. */
function updateRecord(
  sheet: BenchSheet | undefined,
  key: string,
  update: (record: BenchRecord | null) => BenchRecord,
): BenchSheet | undefined {
  if (!sheet) return sheet;
  const apply = (i: BenchItem) => (i.key === key ? { ...i, record: update(i.record) } : i);
  return {
    ...sheet,
    rework: sheet.rework.map(apply),
    items: sheet.items.map(apply),
    removed: sheet.removed.map((r) => (r.key === key ? { ...r, record: update(r.record) } : r)),
  };
}

/**
 * Bench writes are queued: made offline they wait (and survive a reload, see the provider), then go
 * out one after another in the order they were made when the connection returns. A network error
 * while "online" is retried a few times; anything the server refuses stays in the cache as a
 * failed write that the checklist shows.
 */
export function registerBenchMutations(queryClient: QueryClient) {
  queryClient.setMutationDefaults(RECORD_BENCH_WORK, {
    mutationFn: (input: RecordBenchWorkInput) => sendBenchWork(input),
    retry: (count, error) => error instanceof ApiError && error.status === 0 && count < 3,
    retryDelay: (count) => Math.min(1000 * 2 ** count, 8000),
    onMutate: async (input: RecordBenchWorkInput) => {
      const key = benchKeys.sheet(input.conversionId);
      await queryClient.cancelQueries({ queryKey: key });
      queryClient.setQueryData<BenchSheet>(key, (sheet) =>
        updateRecord(sheet, input.key, (r) => ({
          ...(r ?? {
            key: input.key,
            recordedBy: '',
            recordedAt: '',
            version: -1,
            carriedFrom: null,
            rework: null,
          }),
          ...input.change,
        })),
      );
    },
    onSuccess: (record: BenchRecord, input: RecordBenchWorkInput) => {
      queryClient.setQueryData<BenchSheet>(benchKeys.sheet(input.conversionId), (sheet) =>
        updateRecord(sheet, record.key, (r) => ({ ...r, ...record })),
      );
    },
    onSettled: (_data, _error, input: RecordBenchWorkInput) => {
      // Once the queue has drained, the sheet and test plan are read again from the server.
      if (queryClient.isMutating({ mutationKey: RECORD_BENCH_WORK }) <= 1) {
        void queryClient.invalidateQueries({ queryKey: benchKeys.sheet(input.conversionId) });
        void queryClient.invalidateQueries({
          queryKey: benchKeys.testPlan(input.conversionId, input.revisionNumber),
        });
      }
    },
  });
}

/** Records bench work through the queue; writes on one conversion go out in order. */
export function useRecordBenchWork(conversionId: number) {
  return useMutation<BenchRecord, ApiError, RecordBenchWorkInput>({
    mutationKey: RECORD_BENCH_WORK,
    scope: { id: `bench-${conversionId}` },
  });
}

/** Writes not yet accepted by the server (waiting for the connection or on their way). */
export function useBenchQueue(conversionId: number) {
  const waiting = useMutationState({
    filters: {
      mutationKey: RECORD_BENCH_WORK,
      status: 'pending',
      predicate: (m) =>
        (m.state.variables as RecordBenchWorkInput | undefined)?.conversionId === conversionId,
    },
    select: (m) => m.state.variables as RecordBenchWorkInput,
  });
  const failed = useMutationState({
    filters: {
      mutationKey: RECORD_BENCH_WORK,
      status: 'error',
      predicate: (m) =>
        (m.state.variables as RecordBenchWorkInput | undefined)?.conversionId === conversionId,
    },
    select: (m) => ({
      input: m.state.variables as RecordBenchWorkInput,
      error: m.state.error as ApiError,
      at: m.state.submittedAt,
    }),
  });
  return { waiting, failed };
}

/** Dismisses the failed writes once read: they were never saved, and the sheet shows what is. */
export function useDismissBenchConflicts() {
  const queryClient = useQueryClient();
  return () => {
    const cache = queryClient.getMutationCache();
    for (const m of cache.findAll({ mutationKey: RECORD_BENCH_WORK, status: 'error' })) {
      cache.remove(m);
    }
  };
}

/** Uploads a photo of one item from the tablet's camera (or a file). */
export function useAddBenchPhoto(conversionId: number, revisionNumber: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ key, file }: { key: string; file: File }) => {
      const body = new FormData();
      body.append('file', file);
      return api.post<{ photo: unknown }>(
        `/api/conversions/${conversionId}/revisions/${revisionNumber}/bench/${encodeURIComponent(key)}/photos`,
        body,
      );
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: benchKeys.all }),
  });
}
