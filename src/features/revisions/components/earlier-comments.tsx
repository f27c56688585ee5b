import { pinNames } from '#shared/domain/pin-names.ts';
import type { EarlierComment, RevisionDetail } from '#shared/schemas/revisions.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { formatDate } from '@/lib/format-date.ts';
import { plural } from '@/lib/plural.ts';
import { useMarkAnswered } from '../api/revisions.ts';

/**
 * Remarks made on earlier revisions about a pin or a feed, grouped by what they concern and named
 * as it is in this revision, each with the revision it was made on. The builder marks them
 * answered; open ones come first.
 */
export function EarlierComments({
  conversionId,
  revision,
  canAnswer,
}: {
  conversionId: number;
  revision: RevisionDetail;
  canAnswer: boolean;
}) {
  const answer = useMarkAnswered(conversionId, revision.number);
  const comments = revision.earlierComments;
  if (!comments.length) return null;

  const names = pinNames(revision.snapshot);
  const pins = new Map(revision.snapshot.pins.map((p) => [p.id, p]));
  const feeds = new Map(revision.snapshot.feeds.map((f) => [f.id, f]));
  const subjectOf = (c: EarlierComment): { key: string; label: string; detail: string } => {
    if (c.pinId != null) {
      const pin = pins.get(c.pinId);
      return pin
        ? { key: `pin-${c.pinId}`, label: names.get(pin.id)!, detail: pin.function }
        : { key: `pin-${c.pinId}`, label: c.subjectLabel, detail: 'no longer in the plan' };
    }
    const feed = c.feedId != null ? feeds.get(c.feedId) : undefined;
    return feed
      ? { key: `feed-${c.feedId}`, label: `Feed: ${feed.name}`, detail: '' }
      : { key: `feed-${c.feedId}`, label: c.subjectLabel, detail: 'no longer in the plan' };
  };
  const groups = new Map<string, { label: string; detail: string; items: EarlierComment[] }>();
  for (const c of comments) {
    const s = subjectOf(c);
    const group = groups.get(s.key) ?? { label: s.label, detail: s.detail, items: [] };
    group.items.push(c);
    groups.set(s.key, group);
  }
  const open = comments.filter((c) => !c.answered).length;
  const ordered = [...groups.values()].sort(
    (a, b) => Number(a.items.every((c) => c.answered)) - Number(b.items.every((c) => c.answered)),
  );

  return (
    <section
      aria-labelledby="earlier-comments-heading"
      className="rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h2 id="earlier-comments-heading" className="text-lg font-semibold">
        Earlier comments on pins and feeds
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        {open
          ? `${plural(open, 'comment')} from earlier revisions not yet marked answered.`
          : 'Every comment from earlier revisions is marked answered.'}
      </p>
      <ul className="mt-3 flex flex-col gap-4">
        {ordered.map((g) => (
          <li key={g.label} aria-label={g.label}>
            <p>
              <span className="font-mono font-semibold">{g.label}</span>
              {g.detail ? <span className="ml-2 text-sm text-ink-soft">{g.detail}</span> : null}
            </p>
            <ol className="mt-1 flex flex-col gap-2">
              {g.items.map((c) => (
                <li key={c.id} className="border-l-2 border-rule-strong pl-3">
                  <p className="text-sm text-ink-faint">
                    <span className="rounded border border-rule-strong px-1 text-xs font-semibold text-ink-soft">
                      Revision {c.revisionNumber}
                    </span>{' '}
                    <span className="font-semibold text-ink">{c.authorName}</span> ·{' '}
                    {formatDate(c.createdAt)}
                  </p>
                  <p className="whitespace-pre-wrap">{c.body}</p>
                  {c.answered ? (
                    <p className="text-sm text-sound">
                      <span aria-hidden>✓ </span>Answered by {c.answered.by} on{' '}
                      {formatDate(c.answered.at)}
                    </p>
                  ) : canAnswer ? (
                    <Button
                      size="sm"
                      className="mt-1"
                      busy={answer.isPending && answer.variables === c.id}
                      onClick={() => answer.mutate(c.id)}
                    >
                      Mark answered
                    </Button>
                  ) : (
                    <p className="text-sm text-caution">
                      <span aria-hidden>! </span>Not answered yet
                    </p>
                  )}
                </li>
              ))}
            </ol>
          </li>
        ))}
      </ul>
      {answer.isError ? (
        <p role="alert" className="mt-2 text-sm text-fault">
          {answer.error.message}
        </p>
      ) : null}
    </section>
  );
}
