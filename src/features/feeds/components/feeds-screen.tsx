import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import type { Feed } from '#shared/schemas/feeds.schema.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';
import { SIZE_UNIT_LABELS, type SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useFeeds } from '../api/get-feeds.ts';
import { pinChoices } from '../lib/feed-display.ts';
import { paths } from '@/config/paths.ts';
import { FeedForm } from './feed-form.tsx';
import { FeedsTable, type ChecksState } from './feeds-table.tsx';

/** A message belongs to the view it was given in ("at": the opened feed, or none) and leaves with it. */
type Message = {
  tone: 'sound' | 'caution' | 'fault';
  title: string;
  body?: string;
  at: string | null;
};

/** The search parameter that opens a feed in the form: its id, or "new". */
const FEED_PARAM = 'feed';

/**
 * The feeds of a conversion: a table, and the form for the feed named in the address (so a
 * finding can link straight to it). Writers add, change and delete; others read.
 */
export function FeedsScreen({
  conversionId,
  systemV,
  sizeUnit,
  defaultInsulationC,
  readOnly,
  pins,
  connectors,
  checks,
  onFeedsChanged,
  renderLiveResults,
}: {
  conversionId: number;
  systemV: number;
  sizeUnit: SizeUnit;
  defaultInsulationC: number;
  readOnly: boolean;
  /** The conversion's pins and connectors, for the relay-coil and load pickers; undefined while loading. */
  pins: readonly Pin[] | undefined;
  connectors: readonly Connector[] | undefined;
  checks: ChecksState;
  /** Called after a save or delete: what the checks found is out of date. */
  onFeedsChanged: () => void;
  renderLiveResults: (request: CalcRequestInput) => ReactNode;
}) {
  const feeds = useFeeds(conversionId);
  const [params, setParams] = useSearchParams();
  const [message, setMessage] = useState<Message | null>(null);
  const formRef = useRef<HTMLDivElement>(null);
  const opened = params.get(FEED_PARAM);

  const choices = useMemo(() => pinChoices(pins ?? [], connectors ?? []), [pins, connectors]);
  const pinsById = useMemo(() => new Map(choices.map((p) => [p.id, p])), [choices]);

  const hrefOf = useCallback((feedId: number) => `?${FEED_PARAM}=${feedId}`, []);
  const circuitHrefOf = useCallback(
    (feedId: number) => paths.conversionCircuit.getHref(conversionId, 'feed', feedId),
    [conversionId],
  );

  const open = (value: string | null) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        if (value === null) next.delete(FEED_PARAM);
        else next.set(FEED_PARAM, value);
        return next;
      },
      { preventScrollReset: true },
    );

  useEffect(() => {
    // A feed opened from the table or a finding: bring the form into view.
    if (opened && feeds.data) formRef.current?.scrollIntoView({ block: 'start' });
  }, [opened, feeds.data]);

  if (feeds.isPending) return <Loading what="Loading the feeds" />;
  if (feeds.isError) {
    return (
      <Notice tone="fault" title="The feeds could not be loaded">
        {feeds.error.message}
      </Notice>
    );
  }

  const list = feeds.data;
  const editing: Feed | null | undefined =
    opened === 'new' ? null : list.find((f) => String(f.id) === opened);
  const canOpenForm = opened !== null && (opened !== 'new' || !readOnly);
  const shown = message && message.at === opened ? message : null;

  return (
    <div className="grid gap-5">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h2 className="text-xl font-semibold">Feeds</h2>
          <p className="mt-1 max-w-3xl text-sm text-ink-soft">
            The new fused feeds this conversion adds: where each takes its power, its fuse and
            relay, the wire and the loads it carries. Sizes in {SIZE_UNIT_LABELS[sizeUnit]}, the
            workshop’s unit.
          </p>
        </div>
        {readOnly ? null : (
          <Button variant="primary" onClick={() => open('new')}>
            Add a feed
          </Button>
        )}
      </div>

      {shown && !canOpenForm ? (
        <Notice tone={shown.tone} title={shown.title}>
          {shown.body}
        </Notice>
      ) : null}

      <FeedsTable
        feeds={list}
        pins={pinsById}
        sizeUnit={sizeUnit}
        checks={checks}
        canEdit={!readOnly}
        hrefOf={hrefOf}
        circuitHrefOf={circuitHrefOf}
      />

      <div ref={formRef} className="grid scroll-mt-4 gap-3">
        {shown && canOpenForm ? (
          <Notice tone={shown.tone} title={shown.title}>
            {shown.body}
          </Notice>
        ) : null}
        {canOpenForm && editing === undefined ? (
          <Notice tone="caution" title="That feed is not in this conversion any more">
            Someone may have deleted it. Pick a feed from the table.
          </Notice>
        ) : canOpenForm && editing !== undefined ? (
          <FeedForm
            // Keyed by feed only: the form outlives its own save so the save's callbacks run.
            key={editing ? editing.id : 'new'}
            conversionId={conversionId}
            systemV={systemV}
            feed={editing}
            feeds={list}
            pins={choices}
            sizeUnit={sizeUnit}
            defaultInsulationC={defaultInsulationC}
            readOnly={readOnly}
            renderLiveResults={renderLiveResults}
            onClose={() => open(null)}
            onSubmitting={() => setMessage(null)}
            onSaved={(saved, created) => {
              setMessage({
                tone: 'sound',
                title: `${created ? 'Added' : 'Saved'} the feed “${saved.name}”`,
                body: 'The checks are running again with the change.',
                at: null,
              });
              onFeedsChanged();
              open(null);
            }}
            onDeleted={(deleted) => {
              setMessage({ tone: 'sound', title: `Deleted the feed “${deleted.name}”`, at: null });
              onFeedsChanged();
              open(null);
            }}
            onConflict={(current) =>
              setMessage({
                tone: 'caution',
                title: `Someone else changed “${current.name}” since you opened it`,
                body: 'Your change was not saved. The form now shows their copy: make your change again if it is still needed.',
                at: opened,
              })
            }
          />
        ) : null}
      </div>
    </div>
  );
}
