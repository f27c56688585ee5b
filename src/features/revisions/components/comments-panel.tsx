import { useState } from 'react';
import { pinNames } from '#shared/domain/pin-names.ts';
import type { RevisionDetail } from '#shared/schemas/revisions.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextAreaField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useAddComment } from '../api/revisions.ts';
import { formatDate } from '@/lib/format-date.ts';

/** Remarks on the revision as a whole, a pin or a feed of it. */
export function CommentsPanel({
  conversionId,
  revision,
  canComment,
}: {
  conversionId: number;
  revision: RevisionDetail;
  canComment: boolean;
}) {
  const add = useAddComment(conversionId, revision.number);
  const [body, setBody] = useState('');
  const [subject, setSubject] = useState('');
  const names = pinNames(revision.snapshot);
  const pinOptions = revision.snapshot.pins
    .filter((p) => p.disposition !== 'empty')
    .map((p) => ({ value: `pin:${p.id}`, label: `${names.get(p.id)} ${p.function}` }));
  const feedOptions = revision.snapshot.feeds.map((f) => ({
    value: `feed:${f.id}`,
    label: `Feed: ${f.name}`,
  }));

  return (
    <section
      aria-labelledby="comments-heading"
      className="rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h2 id="comments-heading" className="text-lg font-semibold">
        Comments
      </h2>
      {revision.comments.length === 0 ? (
        <p className="mt-2 text-ink-soft">No comments yet.</p>
      ) : null}
      <ol className="mt-2 flex flex-col gap-3">
        {revision.comments.map((c) => (
          <li key={c.id} className="border-l-2 border-rule-strong pl-3">
            <p className="text-sm text-ink-faint">
              <span className="font-semibold text-ink">{c.authorName}</span>
              {c.subjectLabel ? (
                <>
                  {' '}
                  on <span className="font-mono text-ink">{c.subjectLabel}</span>
                </>
              ) : null}{' '}
              · {formatDate(c.createdAt)}
            </p>
            <p className="whitespace-pre-wrap">{c.body}</p>
          </li>
        ))}
      </ol>
      {canComment ? (
        <form
          className="mt-4 grid max-w-3xl gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (!body.trim()) return;
            const [kind, id] = subject.split(':');
            add.mutate(
              {
                body: body.trim(),
                pinId: kind === 'pin' ? Number(id) : null,
                feedId: kind === 'feed' ? Number(id) : null,
              },
              { onSuccess: () => setBody('') },
            );
          }}
        >
          <SelectField label="About" value={subject} onChange={(e) => setSubject(e.target.value)}>
            <option value="">The revision as a whole</option>
            <optgroup label="Feeds">
              {feedOptions.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </optgroup>
            <optgroup label="Pins">
              {pinOptions.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </optgroup>
          </SelectField>
          <TextAreaField
            label="Comment"
            value={body}
            maxLength={4000}
            onChange={(e) => setBody(e.target.value)}
          />
          {add.error ? (
            <Notice tone="fault" title="Comment not saved">
              {add.error.message}
            </Notice>
          ) : null}
          <div>
            <Button type="submit" busy={add.isPending} disabled={!body.trim()}>
              Add comment
            </Button>
          </div>
        </form>
      ) : null}
    </section>
  );
}
