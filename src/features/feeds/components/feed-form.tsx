import { useId, useState, type FormEvent, type ReactNode } from 'react';
import { CONDUCTOR_TEMP_C } from '#shared/domain/checks/check-context.ts';
import { BLADE_FUSES, recommendedFuseA } from '#shared/domain/electrical/fuses.ts';
import {
  AWG_GAUGES,
  exactAwg,
  formatAwgGauge,
  ISO_6722_SIZES_MM2,
  parseWireSize,
} from '#shared/domain/wire-sizes.ts';
import { parseWireColour } from '#shared/domain/wire-colours.ts';
import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import {
  DROP_CLASS_LABELS,
  DROP_CLASSES,
  FEED_SOURCE_LABELS,
  FEED_SOURCES,
  RETURN_PATH_LABELS,
  RETURN_PATHS,
  WIRE_ZONE_LABELS,
  WIRE_ZONES,
  type Feed,
} from '#shared/schemas/feeds.schema.ts';
import {
  INSULATION_RATINGS_C,
  SIZE_UNIT_LABELS,
  type SizeUnit,
} from '#shared/schemas/workshop.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useCreateFeed } from '../api/create-feed.ts';
import { useDeleteFeed } from '../api/delete-feed.ts';
import { conflictCopy, useUpdateFeed } from '../api/update-feed.ts';
import { fuseLabel, num, type PinChoice } from '../lib/feed-display.ts';
import {
  emptyFeedForm,
  feedToForm,
  formToCalcRequest,
  formToRequest,
  isFormField,
  NO_FUSE,
  readNumber,
  upstreamFuse,
  type FeedFormValues,
  type FieldErrors,
} from '../lib/feed-form.ts';
import { LoadsEditor } from './loads-editor.tsx';
import { PinOptions } from './pin-options.tsx';

function Group({
  legend,
  children,
  columns = 'sm:grid-cols-2',
}: {
  legend: string;
  children: ReactNode;
  /** The grid's columns, as Tailwind classes. */
  columns?: string;
}) {
  return (
    <fieldset className={`grid gap-4 border-t border-rule pt-4 ${columns}`}>
      <legend className="pr-2 text-xs font-semibold tracking-[0.12em] text-copper-deep uppercase">
        {legend}
      </legend>
      {children}
    </fieldset>
  );
}

export interface FeedFormProps {
  conversionId: number;
  systemV: number;
  /** The feed being edited, or null for a new one. */
  feed: Feed | null;
  feeds: Feed[];
  pins: PinChoice[];
  sizeUnit: SizeUnit;
  defaultInsulationC: number;
  readOnly: boolean;
  onSaved: (feed: Feed, created: boolean) => void;
  onDeleted: (feed: Feed) => void;
  onConflict: (current: Feed) => void;
  /** A new attempt: whatever the screen said about the last one no longer applies. */
  onSubmitting: () => void;
  onClose: () => void;
  /** The calculator's answer for these inputs, composed in by the route. */
  renderLiveResults: (request: CalcRequestInput) => ReactNode;
}

/** Add or change one feed: fuse, relay, wire, loads and drop limit, with live results beside. */
export function FeedForm({
  conversionId,
  systemV,
  feed,
  feeds,
  pins,
  sizeUnit,
  defaultInsulationC,
  readOnly,
  onSaved,
  onDeleted,
  onConflict,
  onSubmitting,
  onClose,
  renderLiveResults,
}: FeedFormProps) {
  const [values, setValues] = useState<FeedFormValues>(() =>
    feed ? feedToForm(feed, sizeUnit) : emptyFeedForm({ insulationRatingC: defaultInsulationC }),
  );
  // The copy the builder started from: saved against it, so a change someone else made meanwhile is
  // a conflict rather than silently overwritten.
  const [baseVersion, setBaseVersion] = useState(feed?.version ?? 0);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const create = useCreateFeed(conversionId);
  const update = useUpdateFeed(conversionId);
  const remove = useDeleteFeed(conversionId);
  const headingId = useId();
  const sizeListId = useId();

  const set = <K extends keyof FeedFormValues>(key: K, value: FeedFormValues[K]) =>
    setValues((v) => ({ ...v, [key]: value }));

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
  const sizePreview = parseWireSize(values.wireSize, sizeUnit);
  const colourPreview = values.colour.trim() ? parseWireColour(values.colour) : null;

  function handleError(error: unknown) {
    const current = conflictCopy(error);
    if (current) {
      // Load their copy into the form; the builder makes the change again on top of it.
      setValues(feedToForm(current, sizeUnit));
      setBaseVersion(current.version);
      setErrors({});
      setProblem(null);
      onConflict(current);
      return;
    }
    if (error instanceof ApiError) {
      const issues = error.fieldIssues();
      if (Object.keys(issues).length) {
        setErrors(issues);
        const unmarked = Object.entries(issues).filter(([field]) => !isFormField(field));
        setProblem(
          unmarked.length
            ? unmarked.map(([field, message]) => `${field}: ${message}`).join('; ')
            : error.status === 400
              ? 'Some fields need correcting: see the marks.'
              : error.message,
        );
        return;
      }
    }
    setProblem(error instanceof Error ? error.message : 'The feed was not saved.');
  }

  // mutateAsync, not mutate: a save or delete changes the list the form sits in, and the form may
  // unmount before mutate's own callbacks would run; the parent's callbacks must still run.
  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (readOnly) return;
    onSubmitting();
    const read = formToRequest(values, sizeUnit);
    if (!read.ok) {
      setErrors(read.errors);
      setProblem('Some fields need correcting: see the marks.');
      return;
    }
    setErrors({});
    setProblem(null);
    try {
      if (feed) {
        const { feed: saved } = await update.mutateAsync({
          feedId: feed.id,
          input: { ...read.request, version: baseVersion },
        });
        onSaved(saved, false);
      } else {
        const { feed: saved } = await create.mutateAsync(read.request);
        onSaved(saved, true);
      }
    } catch (error) {
      handleError(error);
    }
  }

  async function confirmDelete() {
    if (!feed) return;
    try {
      await remove.mutateAsync(feed.id);
      onDeleted(feed);
    } catch (error) {
      setConfirmingDelete(false);
      setProblem(error instanceof Error ? error.message : 'The feed was not deleted.');
    }
  }

  const heading = feed
    ? readOnly
      ? `Feed “${feed.name}”`
      : `Edit feed “${feed.name}”`
    : 'New feed';
  const fuseA = readNumber(values.fuseA === NO_FUSE ? '' : values.fuseA);
  const standardFuse =
    values.fuseA === NO_FUSE || BLADE_FUSES.some((f) => String(f.ratingA) === values.fuseA);
  const totals = live.ok ? live.totals : null;
  const loadFuse =
    totals && totals.nonContinuousA > 0 && totals.totalA > 0
      ? recommendedFuseA(totals.continuousA, totals.nonContinuousA)
      : null;

  return (
    <section
      aria-labelledby={headingId}
      className="grid items-start gap-6 rounded-lg border border-rule bg-paper-raised p-5 xl:grid-cols-[minmax(0,1fr)_24rem]"
    >
      <form noValidate onSubmit={(e) => void submit(e)} className="grid gap-5">
        <div className="flex flex-wrap items-baseline justify-between gap-3">
          <h2 id={headingId} className="text-lg font-semibold">
            {heading}
          </h2>
          {readOnly ? (
            <span className="text-sm text-ink-faint">
              Read only: your role cannot change feeds.
            </span>
          ) : null}
        </div>

        <fieldset disabled={readOnly} className="grid min-w-0 gap-6">
          <Group legend="Feed">
            <TextField
              label="Name"
              name="name"
              value={values.name}
              maxLength={80}
              onChange={(e) => set('name', e.target.value)}
              error={errors.name}
              placeholder="e.g. Cooling fan"
            />
            <SelectField
              label="Source"
              name="source"
              value={values.source}
              onChange={(e) => set('source', e.target.value as FeedFormValues['source'])}
              error={errors.source}
            >
              {FEED_SOURCES.map((s) => (
                <option key={s} value={s}>
                  {FEED_SOURCE_LABELS[s]}
                </option>
              ))}
            </SelectField>
            {values.source === 'relay_output' ? (
              <SelectField
                label="Relay output of"
                name="sourceFeedId"
                value={values.sourceFeedId}
                onChange={(e) => set('sourceFeedId', e.target.value)}
                error={errors.sourceFeedId}
              >
                <option value="">— pick the feed whose relay powers this one —</option>
                {otherFeeds.map((f) => (
                  <option key={f.id} value={String(f.id)}>
                    {f.name}
                    {f.relay ? '' : ' (no relay yet)'}
                  </option>
                ))}
              </SelectField>
            ) : null}
            <SelectField
              label="Fuse"
              name="fuseA"
              value={values.fuseA}
              onChange={(e) => set('fuseA', e.target.value)}
              error={errors.fuseA}
              className="font-mono"
            >
              {values.fuseA === '' ? <option value="">— choose a rating —</option> : null}
              <option value={NO_FUSE}>No fuse</option>
              {BLADE_FUSES.map((f) => (
                <option key={f.ratingA} value={String(f.ratingA)}>
                  {fuseLabel(f.ratingA)}
                </option>
              ))}
              {!standardFuse && fuseA.ok && fuseA.value !== null ? (
                <option value={values.fuseA}>{fuseLabel(fuseA.value)}</option>
              ) : null}
            </SelectField>
            {values.fuseA === NO_FUSE ? (
              <div className="sm:col-span-2">
                {upstream ? (
                  <Notice
                    tone="info"
                    title={`Protected upstream by the ${fuseLabel(upstream.fuseA)} fuse of “${upstream.feedName}”`}
                  >
                    The checks test this feed’s wire against that fuse.
                  </Notice>
                ) : (
                  <Notice tone="caution" title="A feed without a fuse is a fire risk">
                    Fit a fuse near the source; the checks will report this feed as an error.
                  </Notice>
                )}
              </div>
            ) : null}
          </Group>

          <Group legend="Relay">
            <label className="flex items-center gap-2 text-sm font-medium text-ink sm:col-span-2">
              <input
                type="checkbox"
                className="size-4 accent-copper"
                checked={values.hasRelay}
                onChange={(e) => set('hasRelay', e.target.checked)}
              />
              Switched by a relay
            </label>
            {values.hasRelay ? (
              <>
                <TextField
                  label="Contact rating (A)"
                  name="relayContactRatingA"
                  inputMode="decimal"
                  className="font-mono"
                  value={values.relayContactRatingA}
                  onChange={(e) => set('relayContactRatingA', e.target.value)}
                  error={errors['relay.contactRatingA']}
                />
                <TextField
                  label="Coil current (A)"
                  name="relayCoilCurrentA"
                  inputMode="decimal"
                  className="font-mono"
                  value={values.relayCoilCurrentA}
                  onChange={(e) => set('relayCoilCurrentA', e.target.value)}
                  error={errors['relay.coilCurrentA']}
                />
                <div className="sm:col-span-2">
                  <SelectField
                    label="Coil driven by pin"
                    name="relayCoilPinId"
                    value={values.relayCoilPinId}
                    onChange={(e) => set('relayCoilPinId', e.target.value)}
                    error={errors['relay.coilPinId']}
                    hint="Usually the ECU switches the coil’s ground side (terminal 85 or 86)."
                  >
                    <option value="">— not from a pin of the map —</option>
                    <PinOptions pins={pins} />
                  </SelectField>
                </div>
              </>
            ) : null}
          </Group>

          <Group legend="Wire" columns="sm:grid-cols-2 lg:grid-cols-3">
            <TextField
              label={`Size (${SIZE_UNIT_LABELS[sizeUnit]})`}
              name="wireSize"
              list={sizeListId}
              autoComplete="off"
              className="font-mono"
              value={values.wireSize}
              onChange={(e) => set('wireSize', e.target.value)}
              error={errors['wire.sizeMm2']}
              hint={
                sizeUnit === 'awg' &&
                sizePreview.ok &&
                sizePreview.areaMm2 !== null &&
                exactAwg(sizePreview.areaMm2) !== null
                  ? `= ${num(sizePreview.areaMm2, 3)} mm² of copper`
                  : sizeUnit === 'mm2'
                    ? 'ISO 6722, e.g. 1.5; or “16 AWG”'
                    : 'A gauge, e.g. 16; or “1.5 mm²”'
              }
            />
            <datalist id={sizeListId}>
              {sizeUnit === 'mm2'
                ? ISO_6722_SIZES_MM2.map((s) => <option key={s} value={String(s)} />)
                : AWG_GAUGES.map((g) => <option key={g} value={formatAwgGauge(g)} />)}
            </datalist>
            <SelectField
              label="Insulation rating"
              name="insulationRatingC"
              value={values.insulationRatingC}
              onChange={(e) => set('insulationRatingC', e.target.value)}
              error={errors['wire.insulationRatingC']}
            >
              {INSULATION_RATINGS_C.map((c) => (
                <option key={c} value={String(c)}>
                  {c} °C
                </option>
              ))}
            </SelectField>
            <TextField
              label="One-way length (m)"
              name="lengthM"
              inputMode="decimal"
              className="font-mono"
              value={values.lengthM}
              onChange={(e) => set('lengthM', e.target.value)}
              error={errors['wire.lengthM']}
              hint="From the fuse to the load."
            />
            <SelectField
              label="Zone"
              name="zone"
              value={values.zone}
              onChange={(e) => set('zone', e.target.value as FeedFormValues['zone'])}
              error={errors['wire.zone']}
            >
              {WIRE_ZONES.map((z) => (
                <option key={z} value={z}>
                  {WIRE_ZONE_LABELS[z]}
                </option>
              ))}
            </SelectField>
            <SelectField
              label="Return"
              name="returnPath"
              value={values.returnPath}
              onChange={(e) => set('returnPath', e.target.value as FeedFormValues['returnPath'])}
              error={errors['wire.returnPath']}
            >
              {RETURN_PATHS.map((r) => (
                <option key={r} value={r}>
                  {RETURN_PATH_LABELS[r]}
                </option>
              ))}
            </SelectField>
            <TextField
              label="Conductors in the bundle"
              name="bundled"
              inputMode="numeric"
              className="font-mono"
              value={values.bundled}
              onChange={(e) => set('bundled', e.target.value)}
              error={errors['wire.bundled']}
              hint="This one included."
            />
            <TextField
              label="Colour (IEC 60757)"
              name="colour"
              autoComplete="off"
              className="font-mono uppercase"
              value={values.colour}
              onChange={(e) => set('colour', e.target.value)}
              error={errors['wire.colour']}
              hint={
                colourPreview?.ok ? (
                  <WireColour value={colourPreview.value} />
                ) : (
                  'Base and stripe, e.g. BU/WH'
                )
              }
            />
          </Group>

          <fieldset className="grid gap-2 border-t border-rule pt-4">
            <legend className="pr-2 text-xs font-semibold tracking-[0.12em] text-copper-deep uppercase">
              Loads
            </legend>
            <LoadsEditor
              loads={values.loads}
              pins={pins}
              errors={errors}
              readOnly={readOnly}
              onChange={(loads) => set('loads', loads)}
            />
            {totals ? (
              <p className="text-sm text-ink-soft">
                Through the fuse and wire:{' '}
                <span className="font-mono font-semibold text-ink">{num(totals.totalA)} A</span> (
                <span className="font-mono">{num(totals.continuousA)} A</span> continuous)
                {feed && feeds.some((f) => f.sourceFeedId === feed.id)
                  ? ', including the feeds this relay powers'
                  : ''}
                .
              </p>
            ) : null}
          </fieldset>

          <Group legend="Voltage drop" columns="sm:grid-cols-[2fr_1fr]">
            <SelectField
              label="Drop class"
              name="dropClass"
              value={values.dropClass}
              onChange={(e) => set('dropClass', e.target.value as FeedFormValues['dropClass'])}
              error={errors.dropClass}
            >
              {DROP_CLASSES.map((c) => (
                <option key={c} value={c}>
                  {DROP_CLASS_LABELS[c]}
                </option>
              ))}
            </SelectField>
            <TextField
              label="Override limit (%)"
              name="dropLimitPct"
              inputMode="decimal"
              className="font-mono"
              value={values.dropLimitPct}
              onChange={(e) => set('dropLimitPct', e.target.value)}
              error={errors.dropLimitPct}
              hint="Empty uses the class’s limit (ABYC E-11)."
            />
          </Group>

          <TextAreaField
            label="Notes"
            name="notes"
            maxLength={2000}
            value={values.notes}
            onChange={(e) => set('notes', e.target.value)}
            error={errors.notes}
          />
        </fieldset>

        {problem ? (
          <Notice tone="fault" title="The feed was not saved">
            {problem}
          </Notice>
        ) : null}

        {confirmingDelete && feed ? (
          <div
            role="alertdialog"
            aria-labelledby={`${headingId}-delete`}
            className="flex flex-wrap items-center gap-3 rounded-md border border-fault/40 bg-fault-wash px-4 py-3"
          >
            <p id={`${headingId}-delete`} className="text-sm font-semibold text-ink">
              Delete the feed “{feed.name}” and its loads? Pins joined to it lose their destination.
            </p>
            <div className="ml-auto flex gap-2">
              <Button variant="danger" busy={remove.isPending} onClick={() => void confirmDelete()}>
                Delete feed
              </Button>
              <Button variant="quiet" onClick={() => setConfirmingDelete(false)}>
                Keep it
              </Button>
            </div>
          </div>
        ) : null}

        <div className="flex flex-wrap gap-2">
          {readOnly ? (
            <Button onClick={onClose}>Close</Button>
          ) : (
            <>
              <Button type="submit" variant="primary" busy={create.isPending || update.isPending}>
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

      <aside
        aria-label="Live results"
        className="rounded-md border border-rule bg-paper p-4 xl:sticky xl:top-4"
      >
        <h3 className="font-semibold">Live results</h3>
        <p className="mb-2 text-xs text-ink-faint">
          As the checks will see this feed: the conductor at {CONDUCTOR_TEMP_C[values.zone]} °C, the
          ambient Table 5 assumes {values.zone === 'engine_bay' ? 'in' : 'outside'} the engine bay.
        </p>
        {live.ok ? (
          <>
            {live.fuseFrom ? (
              <p className="mb-2 text-sm text-ink-soft">
                Fuse: the {num(live.request.fuseA ?? 0)} A fuse of “{live.fuseFrom}”, upstream.
              </p>
            ) : null}
            {live.request.fuseA === undefined ? (
              <p className="mb-2 text-sm font-semibold text-fault">
                <span aria-hidden>✕ </span>
                {values.fuseA === NO_FUSE
                  ? 'No fuse: a fire risk.'
                  : 'No fuse chosen yet: the fuse checks wait for one.'}
              </p>
            ) : null}
            {loadFuse !== null ? (
              <p className="mb-2 text-sm text-ink-soft">
                With the non-continuous loads at 100 %, the checks size the fuse at{' '}
                <span className="font-mono">{fuseLabel(loadFuse)}</span>.
              </p>
            ) : null}
            {renderLiveResults(live.request)}
          </>
        ) : (
          <p className="text-sm text-ink-soft">{live.missing}</p>
        )}
      </aside>
    </section>
  );
}
