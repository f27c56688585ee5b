import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState, type FormEvent } from 'react';
import { useForm } from 'react-hook-form';
import type { CreateFeedRequest, Feed } from '#shared/schemas/feeds.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { ApiError } from '@/lib/api-client.ts';
import { markServerIssues } from '@/lib/form-errors.ts';
import { useCreateFeed } from '../api/create-feed.ts';
import { useDeleteFeed } from '../api/delete-feed.ts';
import { conflictCopy, useUpdateFeed } from '../api/update-feed.ts';
import {
  emptyFeedForm,
  feedFormSchema,
  feedToForm,
  isFormField,
  type FeedFormValues,
} from '../lib/feed-form.ts';

const NEEDS_CORRECTING = 'Some fields need correcting: see the marks.';

export interface FeedFormOptions {
  conversionId: number;
  /** The feed being edited, or null for a new one. */
  feed: Feed | null;
  sizeUnit: SizeUnit;
  defaultInsulationC: number;
  readOnly: boolean;
  onSaved: (feed: Feed, created: boolean) => void;
  onDeleted: (feed: Feed) => void;
  onConflict: (current: Feed) => void;
  /** A new attempt: whatever the screen said about the last one no longer applies. */
  onSubmitting: () => void;
}

/**
 * The feed form's state: its values and marks (react-hook-form, checked by the shared schema
 * through the zod resolver), the version it saves against, and save and delete.
 */
export function useFeedForm({
  conversionId,
  feed,
  sizeUnit,
  defaultInsulationC,
  readOnly,
  onSaved,
  onDeleted,
  onConflict,
  onSubmitting,
}: FeedFormOptions) {
  const [defaultValues] = useState<FeedFormValues>(() =>
    feed ? feedToForm(feed, sizeUnit) : emptyFeedForm({ insulationRatingC: defaultInsulationC }),
  );
  const resolver = useMemo(() => zodResolver(feedFormSchema(sizeUnit)), [sizeUnit]);
  const form = useForm<FeedFormValues, unknown, CreateFeedRequest>({
    defaultValues,
    resolver,
    // As before the form library: marks change when the builder saves, not while typing.
    mode: 'onSubmit',
    reValidateMode: 'onSubmit',
    shouldFocusError: false,
  });
  // The copy the builder started from: saved against it, so a change someone else made meanwhile is
  // a conflict rather than silently overwritten.
  const [baseVersion, setBaseVersion] = useState(feed?.version ?? 0);
  const [problem, setProblem] = useState<string | null>(null);
  const create = useCreateFeed(conversionId);
  const update = useUpdateFeed(conversionId);
  const remove = useDeleteFeed(conversionId);

  function handleError(error: unknown) {
    const current = conflictCopy(error);
    if (current) {
      // Load their copy into the form; the builder makes the change again on top of it.
      form.reset(feedToForm(current, sizeUnit));
      setBaseVersion(current.version);
      setProblem(null);
      onConflict(current);
      return;
    }
    const issues = markServerIssues(error, form.setError);
    if (Object.keys(issues).length) {
      const unmarked = Object.entries(issues).filter(([field]) => !isFormField(field));
      setProblem(
        unmarked.length
          ? unmarked.map(([field, message]) => `${field}: ${message}`).join('; ')
          : error instanceof ApiError && error.status === 400
            ? NEEDS_CORRECTING
            : (error as Error).message,
      );
      return;
    }
    setProblem(error instanceof Error ? error.message : 'The feed was not saved.');
  }

  // mutateAsync, not mutate: a save or delete changes the list the form sits in, and the form may
  // unmount before mutate's own callbacks would run; the parent's callbacks must still run.
  async function save(request: CreateFeedRequest) {
    setProblem(null);
    try {
      if (feed) {
        const { feed: saved } = await update.mutateAsync({
          feedId: feed.id,
          input: { ...request, version: baseVersion },
        });
        onSaved(saved, false);
      } else {
        const { feed: saved } = await create.mutateAsync(request);
        onSaved(saved, true);
      }
    } catch (error) {
      handleError(error);
    }
  }

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (readOnly) return;
    onSubmitting();
    void form.handleSubmit(save, () => setProblem(NEEDS_CORRECTING))(event);
  }

  async function deleteFeed(): Promise<boolean> {
    if (!feed) return false;
    try {
      await remove.mutateAsync(feed.id);
      onDeleted(feed);
      return true;
    } catch (error) {
      setProblem(error instanceof Error ? error.message : 'The feed was not deleted.');
      return false;
    }
  }

  return {
    form,
    submit,
    problem,
    saving: create.isPending || update.isPending,
    deleting: remove.isPending,
    deleteFeed,
  };
}
