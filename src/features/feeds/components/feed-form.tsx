import { Link } from 'react-router-dom';
import { useId, useState, type ReactNode } from 'react';
import { Controller, FormProvider, useFormContext } from 'react-hook-form';
import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import { DROP_CLASS_LABELS, DROP_CLASSES, type Feed } from '#shared/schemas/feeds.schema.ts';
import { paths } from '@/config/paths.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useErrorOf } from '@/lib/form-errors.ts';
import { useFeedForm, type FeedFormOptions } from '../hooks/use-feed-form.ts';
import { num, type PinChoice } from '../lib/feed-display.ts';
import type { FeedFormValues } from '../lib/feed-form.ts';
import { formToCalcRequest, upstreamFuse, type LoadTotals } from '../lib/feed-live-calc.ts';
import { DeleteConfirm } from './delete-confirm.tsx';
import { FeedSourceFields } from './feed-source-fields.tsx';
import { FormGroup } from './form-group.tsx';
import { LiveResults } from './live-results.tsx';
import { LoadsEditor } from './loads-editor.tsx';
import { RelayFields } from './relay-fields.tsx';
import { WireFields } from './wire-fields.tsx';

export interface FeedFormProps extends FeedFormOptions {
  systemV: number;
  feeds: Feed[];
  pins: PinChoice[];
  onClose: () => void;
  /** The calculator's answer for these inputs, composed in by the route. */
  renderLiveResults: (request: CalcRequestInput) => ReactNode;
}

function LoadsFields({
  pins,
  readOnly,
  totals,
  powersOthers,
}: {
  pins: PinChoice[];
  readOnly: boolean;
  totals: LoadTotals | null;
  /** Whether this feed's relay powers other feeds, whose loads count in its totals. */
  powersOthers: boolean;
}) {
  const { control } = useFormContext<FeedFormValues>();
  const errorOf = useErrorOf();
  return (
    <fieldset className="grid gap-2 border-t border-rule pt-4">
      <legend className="pr-2 text-xs font-semibold tracking-[0.12em] text-copper-deep uppercase">
        Loads
      </legend>
      <Controller
        control={control}
        name="loads"
        render={({ field }) => (
          <LoadsEditor
            loads={field.value}
            pins={pins}
            errorOf={errorOf}
            readOnly={readOnly}
            onChange={field.onChange}
          />
        )}
      />
      {totals ? (
        <p className="text-sm text-ink-soft">
          Through the fuse and wire:{' '}
          <span className="font-mono font-semibold text-ink">{num(totals.totalA)} A</span> (
          <span className="font-mono">{num(totals.continuousA)} A</span> continuous)
          {powersOthers ? ', including the feeds this relay powers' : ''}.
        </p>
      ) : null}
    </fieldset>
  );
}

function DropAndNotes() {
  const { register } = useFormContext<FeedFormValues>();
  const errorOf = useErrorOf();
  return (
    <>
      <FormGroup legend="Voltage drop" columns="sm:grid-cols-[2fr_1fr]">
        <SelectField label="Drop class" {...register('dropClass')} error={errorOf('dropClass')}>
          {DROP_CLASSES.map((c) => (
            <option key={c} value={c}>
              {DROP_CLASS_LABELS[c]}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Override limit (%)"
          inputMode="decimal"
          className="font-mono"
          {...register('dropLimitPct')}
          error={errorOf('dropLimitPct')}
          hint="Empty uses the class’s limit (ABYC E-11)."
        />
      </FormGroup>
      <TextAreaField
        label="Notes"
        maxLength={2000}
        {...register('notes')}
        error={errorOf('notes')}
      />
    </>
  );
}

/** Add or change one feed: fuse, relay, wire, loads and drop limit, with live results beside. */
export function FeedForm({
  systemV,
  feed,
  feeds,
  pins,
  sizeUnit,
  readOnly,
  onClose,
  renderLiveResults,
  ...options
}: FeedFormProps) {
  const { form, submit, problem, saving, deleting, deleteFeed } = useFeedForm({
    ...options,
    feed,
    sizeUnit,
    readOnly,
  });
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const headingId = useId();
  // Every change redraws the live results, as it did when the form kept its own state.
  const values = form.watch();

  const otherFeeds = feeds.filter((f) => f.id !== feed?.id);
  const live = formToCalcRequest(values, sizeUnit, {
    systemV,
    feedId: feed?.id ?? null,
    feeds: otherFeeds,
  });
  const upstream =
    values.source === 'relay_output' && values.sourceFeedId
      ? upstreamFuse(Number(values.sourceFeedId), otherFeeds)
      : null;

  const heading = feed
    ? readOnly
      ? `Feed “${feed.name}”`
      : `Edit feed “${feed.name}”`
    : 'New feed';

  return (
    <section
      aria-labelledby={headingId}
      className="grid items-start gap-6 rounded-lg border border-rule bg-paper-raised p-5 xl:grid-cols-[minmax(0,1fr)_24rem]"
    >
      <FormProvider {...form}>
        <form noValidate onSubmit={submit} className="grid gap-5">
          <div className="flex flex-wrap items-baseline justify-between gap-3">
            <h2 id={headingId} className="text-lg font-semibold">
              {heading}
            </h2>
            {feed ? (
              <Link
                to={paths.conversionCircuit.getHref(feed.conversionId, 'feed', feed.id)}
                className="text-sm text-copper-deep underline-offset-2 hover:underline"
              >
                Show circuit
              </Link>
            ) : null}
            {readOnly ? (
              <span className="text-sm text-ink-faint">
                Read only: your role cannot change feeds.
              </span>
            ) : null}
          </div>

          <fieldset disabled={readOnly} className="grid min-w-0 gap-6">
            <FeedSourceFields values={values} otherFeeds={otherFeeds} upstream={upstream} />
            <RelayFields hasRelay={values.hasRelay} pins={pins} />
            <WireFields values={values} sizeUnit={sizeUnit} />
            <LoadsFields
              pins={pins}
              readOnly={readOnly}
              totals={live.ok ? live.totals : null}
              powersOthers={!!feed && feeds.some((f) => f.sourceFeedId === feed.id)}
            />
            <DropAndNotes />
          </fieldset>

          {problem ? (
            <Notice tone="fault" title="The feed was not saved">
              {problem}
            </Notice>
          ) : null}

          {confirmingDelete && feed ? (
            <DeleteConfirm
              feedName={feed.name}
              busy={deleting}
              onDelete={() =>
                void deleteFeed().then((deleted) => deleted || setConfirmingDelete(false))
              }
              onKeep={() => setConfirmingDelete(false)}
            />
          ) : null}

          <div className="flex flex-wrap gap-2">
            {readOnly ? (
              <Button onClick={onClose}>Close</Button>
            ) : (
              <>
                <Button type="submit" variant="primary" busy={saving}>
                  {feed ? 'Save feed' : 'Add feed'}
                </Button>
                <Button variant="quiet" onClick={onClose}>
                  Cancel
                </Button>
                {feed && !confirmingDelete ? (
                  <Button
                    variant="danger"
                    className="ml-auto"
                    onClick={() => setConfirmingDelete(true)}
                  >
                    Delete…
                  </Button>
                ) : null}
              </>
            )}
          </div>
        </form>
      </FormProvider>

      <LiveResults values={values} live={live} renderLiveResults={renderLiveResults} />
    </section>
  );
}
