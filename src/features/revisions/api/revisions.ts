import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  RevisionVerification,
  ReviewComment,
  ReviewCommentRequest,
  RevisionDetail,
  RevisionSummary,
  SendBackRequest,
  SignOffRequest,
  SubmitRevisionRequest,
} from '#shared/schemas/revisions.schema.ts';
import { api } from '@/lib/api-client.ts';

export const revisionKeys = {
  all: ['revisions'] as const,
  lists: () => [...revisionKeys.all, 'list'] as const,
  list: (conversionId: number) => [...revisionKeys.lists(), conversionId] as const,
  details: () => [...revisionKeys.all, 'detail'] as const,
  detail: (conversionId: number, number: number) =>
    [...revisionKeys.details(), conversionId, number] as const,
  verify: (conversionId: number, number: number) =>
    [...revisionKeys.all, 'verify', conversionId, number] as const,
};

const base = (conversionId: number) => `/api/conversions/${conversionId}/revisions`;

export const getRevisions = (conversionId: number) =>
  api.get<{ revisions: RevisionSummary[] }>(base(conversionId)).then((r) => r.revisions);

export const getRevisionsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: revisionKeys.list(conversionId),
    queryFn: () => getRevisions(conversionId),
  });

export const useRevisions = (conversionId: number) =>
  useQuery(getRevisionsQueryOptions(conversionId));

export const getRevision = (conversionId: number, number: number) =>
  api.get<{ revision: RevisionDetail }>(`${base(conversionId)}/${number}`).then((r) => r.revision);

export const getRevisionQueryOptions = (conversionId: number, number: number) =>
  queryOptions({
    queryKey: revisionKeys.detail(conversionId, number),
    queryFn: () => getRevision(conversionId, number),
  });

export const useRevision = (conversionId: number, number: number) =>
  useQuery(getRevisionQueryOptions(conversionId, number));

export const verifyRevision = (conversionId: number, number: number) =>
  api.get<RevisionVerification>(`${base(conversionId)}/${number}/verify`);

/** Verification runs only when asked for (enabled: false until refetch). */
export const useVerifyRevision = (conversionId: number, number: number) =>
  useQuery({
    queryKey: revisionKeys.verify(conversionId, number),
    queryFn: () => verifyRevision(conversionId, number),
    enabled: false,
  });

function useInvalidateRevisions(conversionId: number) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: revisionKeys.list(conversionId) }),
      queryClient.invalidateQueries({ queryKey: [...revisionKeys.details(), conversionId] }),
    ]);
}

export function useSubmitRevision(conversionId: number) {
  const invalidate = useInvalidateRevisions(conversionId);
  return useMutation({
    mutationFn: (input: SubmitRevisionRequest) =>
      api.post<{ revision: RevisionSummary }>(base(conversionId), input).then((r) => r.revision),
    onSuccess: invalidate,
  });
}

/** A reviewer's decision; refreshed even when refused, as someone else may have decided first. */
function useReviewDecision<Input>(
  conversionId: number,
  number: number,
  decision: 'sign-off' | 'send-back',
) {
  const invalidate = useInvalidateRevisions(conversionId);
  return useMutation({
    mutationFn: (input: Input) =>
      api
        .post<{ revision: RevisionSummary }>(`${base(conversionId)}/${number}/${decision}`, input)
        .then((r) => r.revision),
    onSettled: invalidate,
  });
}

export const useSignOff = (conversionId: number, number: number) =>
  useReviewDecision<SignOffRequest>(conversionId, number, 'sign-off');

export const useSendBack = (conversionId: number, number: number) =>
  useReviewDecision<SendBackRequest>(conversionId, number, 'send-back');

export function useAddComment(conversionId: number, number: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewCommentRequest) =>
      api
        .post<{ comment: ReviewComment }>(`${base(conversionId)}/${number}/comments`, input)
        .then((r) => r.comment),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: revisionKeys.detail(conversionId, number) }),
  });
}

export const revisionWorksheetHref = (conversionId: number, number: number) =>
  `${base(conversionId)}/${number}/worksheet.pdf`;

/** The builder marks a comment answered (of this revision or an earlier one). */
export function useMarkAnswered(conversionId: number, number: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (commentId: number) =>
      api
        .post<{ comment: ReviewComment }>(
          `${base(conversionId)}/${number}/comments/${commentId}/answered`,
          {},
        )
        .then((r) => r.comment),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: revisionKeys.detail(conversionId, number) }),
  });
}
