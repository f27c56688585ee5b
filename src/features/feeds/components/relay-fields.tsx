import { useFormContext } from 'react-hook-form';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { useErrorOf } from '@/lib/form-errors.ts';
import type { PinChoice } from '../lib/feed-display.ts';
import type { FeedFormValues } from '../lib/feed-form.ts';
import { FormGroup } from './form-group.tsx';
import { PinOptions } from './pin-options.tsx';

/** Whether a relay switches the feed, its contact and coil, and the pin that drives the coil. */
export function RelayFields({ hasRelay, pins }: { hasRelay: boolean; pins: PinChoice[] }) {
  const { register } = useFormContext<FeedFormValues>();
  const errorOf = useErrorOf();
  return (
    <FormGroup legend="Relay">
      <label className="flex items-center gap-2 text-sm font-medium text-ink sm:col-span-2">
        <input type="checkbox" className="size-4 accent-copper" {...register('hasRelay')} />
        Switched by a relay
      </label>
      {hasRelay ? (
        <>
          <TextField
            label="Contact rating (A)"
            inputMode="decimal"
            className="font-mono"
            {...register('relayContactRatingA')}
            error={errorOf('relay.contactRatingA')}
          />
          <TextField
            label="Coil current (A)"
            inputMode="decimal"
            className="font-mono"
            {...register('relayCoilCurrentA')}
            error={errorOf('relay.coilCurrentA')}
            hint="Used when the coil resistance is not given."
          />
          <TextField
            label="Coil resistance (Ω)"
            inputMode="decimal"
            className="font-mono"
            {...register('relayCoilResistanceOhm')}
            error={errorOf('relay.coilResistanceOhm')}
            hint="From the relay's datasheet; the coil current is worked as V / R and checked against the output that drives it."
          />
          <div className="sm:col-span-2">
            <SelectField
              label="Coil driven by pin"
              {...register('relayCoilPinId')}
              error={errorOf('relay.coilPinId')}
              hint="Usually the ECU switches the coil’s ground side (terminal 85 or 86)."
            >
              <option value="">— not from a pin of the map —</option>
              <PinOptions pins={pins} />
            </SelectField>
          </div>
        </>
      ) : null}
    </FormGroup>
  );
}
