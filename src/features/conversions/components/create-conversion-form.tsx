import { useState, type FormEvent } from 'react';
import { CreateConversionRequest, type Conversion } from '#shared/schemas/conversions.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useCreateConversion } from '../api/create-conversion.ts';

interface Props {
  defaultVoltage: number;
  onCreated: (conversion: Conversion) => void;
  onCancel: () => void;
}

export function CreateConversionForm({ defaultVoltage, onCreated, onCancel }: Props) {
  const create = useCreateConversion();
  const [errors, setErrors] = useState<Record<string, string>>({});

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const parsed = CreateConversionRequest.safeParse({
      name: form.get('name'),
      donorEngine: form.get('donorEngine'),
      receivingVehicle: form.get('receivingVehicle'),
      systemVoltage: Number(form.get('systemVoltage')),
      notes: form.get('notes') || undefined,
    });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: ({ conversion }) => onCreated(conversion),
      onError: (err) => err instanceof ApiError && setErrors(err.fieldIssues()),
    });
  }

  return (
    <form
      onSubmit={submit}
      noValidate
      className="grid gap-4 rounded-lg border border-rule bg-paper-raised p-5 md:grid-cols-2"
    >
      <h2 className="text-lg font-semibold md:col-span-2">New conversion</h2>
      <TextField
        label="Name"
        name="name"
        required
        maxLength={120}
        error={errors.name}
        placeholder="e.g. customer or job name"
      />
      <SelectField
        label="System voltage"
        name="systemVoltage"
        defaultValue={String(defaultVoltage)}
        error={errors.systemVoltage}
      >
        <option value="12">12 V</option>
        <option value="24">24 V</option>
      </SelectField>
      <TextField
        label="Donor engine"
        name="donorEngine"
        required
        maxLength={120}
        error={errors.donorEngine}
      />
      <TextField
        label="Receiving vehicle"
        name="receivingVehicle"
        required
        maxLength={120}
        error={errors.receivingVehicle}
      />
      <div className="md:col-span-2">
        <TextAreaField label="Notes" name="notes" maxLength={4000} error={errors.notes} />
      </div>
      {create.error && !(create.error instanceof ApiError && create.error.status === 400) ? (
        <div className="md:col-span-2">
          <Notice tone="fault" title="The conversion was not created">
            {create.error.message}
          </Notice>
        </div>
      ) : null}
      <div className="flex gap-2 md:col-span-2">
        <Button type="submit" variant="primary" busy={create.isPending}>
          Create conversion
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
