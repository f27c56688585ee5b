import type { FormEvent } from 'react';
import { INSULATION_RATINGS_C, type WorkshopSettings } from '#shared/schemas/workshop.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useUpdateWorkshop } from '../api/workshop.ts';

export function SettingsForm({ workshop }: { workshop: WorkshopSettings }) {
  const update = useUpdateWorkshop();
  const errors = update.error instanceof ApiError ? update.error.fieldIssues() : {};

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
