import { useState } from 'react';
import type { RevisionDetail } from '#shared/schemas/revisions.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { TextAreaField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useSendBack, useSignOff } from '../api/revisions.ts';

interface Props {
  conversionId: number;
  revision: RevisionDetail;
  /** The signed-in reviewer's name: nobody reviews their own submission. */
  reviewerName: string;
}

/** Sign off, or send back with a comment: only for a revision in review, never one's own. */
export function ReviewActions({ conversionId, revision, reviewerName }: Props) {
  const signOff = useSignOff(conversionId, revision.number);
  const sendBack = useSendBack(conversionId, revision.number);
  const [confirming, setConfirming] = useState(false);
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string | null>(null);

  if (revision.status !== 'in_review') return null;
  if (revision.submittedBy === reviewerName) {
    return (
      <Notice tone="info" title="You submitted this revision">
        Another reviewer must review it.
      </Notice>
    );
  }
  const error = signOff.error ?? sendBack.error;
  return (
    <section
      aria-labelledby="review-heading"
      className="rounded-lg border-2 border-copper/40 bg-paper-raised p-5"
    >
      <h2 id="review-heading" className="text-lg font-semibold">
        Your review
      </h2>
      {error ? (
        <div className="mt-3">
          <Notice tone="fault" title="Not recorded">
            {error.message}
          </Notice>
        </div>
      ) : null}
      <div className="mt-3 grid gap-6 md:grid-cols-2">
        <div>
          <p className="text-sm text-ink-soft">
            Signing off makes this exact revision (hash{' '}
            <span className="font-mono">{revision.hash.slice(0, 12)}</span>) the one the bench works
            from. It cannot be changed afterwards.
          </p>
          {confirming ? (
            <div className="mt-3 flex flex-wrap gap-2">
              <Button
                variant="primary"
                busy={signOff.isPending}
                onClick={() => signOff.mutate({ version: revision.version })}
              >
                Confirm sign-off
              </Button>
              <Button variant="quiet" onClick={() => setConfirming(false)}>
                Cancel
              </Button>
            </div>
          ) : (
            <Button className="mt-3" variant="primary" onClick={() => setConfirming(true)}>
              Sign off revision {revision.number}
            </Button>
          )}
        </div>
        <form
          onSubmit={(e) => {
            e.preventDefault();
            if (!comment.trim()) {
              setCommentError('Say what must change.');
              return;
            }
            setCommentError(null);
            sendBack.mutate({ comment: comment.trim(), version: revision.version });
          }}
        >
          <TextAreaField
            label="Send back with a comment"
            value={comment}
            maxLength={4000}
            error={commentError ?? undefined}
            onChange={(e) => setComment(e.target.value)}
          />
          <Button className="mt-2" type="submit" variant="secondary" busy={sendBack.isPending}>
            Send back for changes
          </Button>
        </form>
      </div>
    </section>
  );
}
