import type { FormEvent } from 'react';
import { INSULATION_RATINGS_C, type WorkshopSettings } from '#shared/schemas/workshop.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useUpdateWorkshop } from '../api/workshop.ts';

export function SettingsForm({ workshop }: { workshop: WorkshopSettings }) {
  const update = useUpdateWorkshop();
  const errors: Record<string, string | undefined> =
    update.error instanceof ApiError ? update.error.fieldIssues() : {};
  const DROP = workshop.dropAllowances;

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    update.mutate({
      name: String(form.get('name')),
      paperSize: form.get('paperSize') as WorkshopSettings['paperSize'],
      sizeUnit: form.get('sizeUnit') as WorkshopSettings['sizeUnit'],
      systemVoltage: Number(form.get('systemVoltage')) as 12 | 24,
      defaultInsulationC: Number(form.get('defaultInsulationC')),
      serviceAllowancePct: Number(form.get('serviceAllowancePct')),
      dropAllowances: {
        fuseV: Number(form.get('dropFuseV')),
        relayContactsV: Number(form.get('dropRelayContactsV')),
        perConnectionV: Number(form.get('dropPerConnectionV')),
        chassisReturnV: Number(form.get('dropChassisReturnV')),
      },
      version: workshop.version,
    });
  }

  return (
    <form
      key={workshop.version}
      onSubmit={submit}
      className="grid max-w-3xl gap-4 rounded-lg border border-rule bg-paper-raised p-5 md:grid-cols-2"
    >
      <TextField
        label="Workshop name"
        name="name"
        defaultValue={workshop.name}
        error={errors.name}
      />
      <SelectField
        label="Paper size for worksheets"
        name="paperSize"
        defaultValue={workshop.paperSize}
      >
        <option value="A4">A4</option>
        <option value="Letter">US Letter</option>
      </SelectField>
      <SelectField
        label="Wire sizes shown in"
        name="sizeUnit"
        defaultValue={workshop.sizeUnit}
        hint="Sizes are always stored in mm²; this only changes how they are shown and typed."
      >
        <option value="mm2">mm² (ISO 6722)</option>
        <option value="awg">AWG (ASTM B258)</option>
      </SelectField>
      <SelectField
        label="Usual system voltage"
        name="systemVoltage"
        defaultValue={String(workshop.systemVoltage)}
      >
        <option value="12">12 V</option>
        <option value="24">24 V</option>
      </SelectField>
      <SelectField
        label="Default wire insulation rating"
        name="defaultInsulationC"
        defaultValue={String(workshop.defaultInsulationC)}
        hint="SAE J1128: GPT 85 °C, TWP 105 °C, TXL/GXL/SXL 125 °C."
      >
        {INSULATION_RATINGS_C.map((c) => (
          <option key={c} value={c}>
            {c} °C
          </option>
        ))}
      </SelectField>
      <TextField
        label="Wire cut-list allowance (%)"
        name="serviceAllowancePct"
        type="number"
        min={0}
        max={100}
        step={1}
        defaultValue={workshop.serviceAllowancePct}
        error={errors.serviceAllowancePct}
      />
      <fieldset className="grid gap-4 md:col-span-2 md:grid-cols-2">
        <legend className="mb-1 font-semibold">Voltage-drop budget</legend>
        <p className="text-sm text-ink-soft md:col-span-2">
          The checks add these to each feed&apos;s own wire before comparing with its drop limit; a
          fuse or relay figure is at its rating and scales with the current through it. The fuse
          figure is from memory (blade-fuse makers list about 0.1 V at the rating); the others are
          common practice. Put in what your own parts measure.
        </p>
        {(
          [
            [
              'dropFuseV',
              'Across a fuse and its holder, at its rating (V)',
              DROP.fuseV,
              errors['dropAllowances.fuseV'],
            ],
            [
              'dropRelayContactsV',
              'Across closed relay contacts, at their rating (V)',
              DROP.relayContactsV,
              errors['dropAllowances.relayContactsV'],
            ],
            [
              'dropPerConnectionV',
              'Per crimped terminal or splice (V)',
              DROP.perConnectionV,
              errors['dropAllowances.perConnectionV'],
            ],
            [
              'dropChassisReturnV',
              'Chassis return path (V)',
              DROP.chassisReturnV,
              errors['dropAllowances.chassisReturnV'],
            ],
          ] as const
        ).map(([name, label, value, error]) => (
          <TextField
            key={name}
            label={label}
            name={name}
            type="number"
            min={0}
            max={2}
            step={0.005}
            defaultValue={value}
            error={error}
            className="font-mono"
          />
        ))}
      </fieldset>
      <div className="flex flex-col gap-3 md:col-span-2">
        {update.error && !Object.keys(errors).length ? (
          <Notice tone="fault" title="Settings not saved">
            {update.error.message}
          </Notice>
        ) : null}
        {update.isSuccess ? <Notice tone="sound" title="Settings saved" /> : null}
        <div>
          <Button type="submit" variant="primary" busy={update.isPending}>
            Save settings
          </Button>
        </div>
      </div>
    </form>
  );
}
