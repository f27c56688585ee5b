import { useFormContext } from 'react-hook-form';
import {
  FUSE_FAMILIES,
  FUSE_TYPES,
  UNFUSED_LENGTH_LIMIT_MM,
} from '#shared/domain/electrical/fuses.ts';
import { FEED_SOURCE_LABELS, FEED_SOURCES, type Feed } from '#shared/schemas/feeds.schema.ts';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useErrorOf } from '@/lib/form-errors.ts';
import { fuseLabel } from '../lib/feed-display.ts';
import { NO_FUSE, readNumber, type FeedFormValues } from '../lib/feed-form.ts';
import { FormGroup } from './form-group.tsx';

/** The feed's name, where its power comes from and the fuse that protects it. */
export function FeedSourceFields({
  values,
  otherFeeds,
  upstream,
}: {
  values: FeedFormValues;
  otherFeeds: Feed[];
  /** The fuse up the chain of relay outputs, when this feed is one. */
  upstream: { fuseA: number; feedName: string } | null;
}) {
  const { register } = useFormContext<FeedFormValues>();
  const errorOf = useErrorOf();
  const fuseA = readNumber(values.fuseA === NO_FUSE ? '' : values.fuseA);
  const family = FUSE_FAMILIES[values.fuseType];
  const standardFuse =
    values.fuseA === NO_FUSE || family.ratings.some((f) => String(f.ratingA) === values.fuseA);

  return (
    <FormGroup legend="Feed">
      <TextField
        label="Name"
        maxLength={80}
        {...register('name')}
        error={errorOf('name')}
        placeholder="e.g. Cooling fan"
      />
      <SelectField label="Source" {...register('source')} error={errorOf('source')}>
        {FEED_SOURCES.map((s) => (
          <option key={s} value={s}>
            {FEED_SOURCE_LABELS[s]}
          </option>
        ))}
      </SelectField>
      {values.source === 'relay_output' ? (
        <SelectField
          label="Relay output of"
          {...register('sourceFeedId')}
          error={errorOf('sourceFeedId')}
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
        label="Fuse type"
        {...register('fuseType')}
        error={errorOf('fuseType')}
        hint={family.description}
      >
        {FUSE_TYPES.map((t) => (
          <option key={t} value={t}>
            {FUSE_FAMILIES[t].label}
          </option>
        ))}
      </SelectField>
      {family.ratings.length ? (
        <SelectField
          label="Fuse"
          {...register('fuseA')}
          error={errorOf('fuseA')}
          className="font-mono"
        >
          {values.fuseA === '' ? <option value="">— choose a rating —</option> : null}
          <option value={NO_FUSE}>No fuse</option>
          {family.ratings.map((f) => (
            <option key={f.ratingA} value={String(f.ratingA)}>
              {fuseLabel(f.ratingA, values.fuseType)}
            </option>
          ))}
          {!standardFuse && fuseA.ok && fuseA.value !== null ? (
            <option value={values.fuseA}>{fuseLabel(fuseA.value, values.fuseType)}</option>
          ) : null}
        </SelectField>
      ) : (
        <TextField
          label="Rating its maker states (A)"
          inputMode="decimal"
          className="font-mono"
          {...register('fuseA')}
          error={errorOf('fuseA')}
        />
      )}
      {values.fuseA !== NO_FUSE ? (
        <>
          <TextField
            label="Unfused wire from the source (mm)"
            inputMode="decimal"
            className="font-mono"
            {...register('unfusedLengthMm')}
            error={errorOf('unfusedLengthMm')}
            hint={`At most ${UNFUSED_LENGTH_LIMIT_MM.bare} mm, ${UNFUSED_LENGTH_LIMIT_MM.sheathed.toLocaleString('en')} mm in a sheath (33 CFR 183.455(b), a marine rule borrowed by analogy). Empty until measured.`}
          />
          <label className="flex items-center gap-2 self-center text-sm font-medium text-ink">
            <input type="checkbox" className="size-4 accent-copper" {...register('fuseSheathed')} />
            Unfused run is in a sheath or enclosure
          </label>
        </>
      ) : null}
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
    </FormGroup>
  );
}
