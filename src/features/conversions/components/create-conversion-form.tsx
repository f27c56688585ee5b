import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { CreateConversionRequest, type Conversion } from '#shared/schemas/conversions.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { blankAsUndefined, errorAt, markServerIssues } from '@/lib/form-errors.ts';
import { useCreateConversion } from '../api/create-conversion.ts';

interface Props {
  defaultVoltage: number;
  onCreated: (conversion: Conversion) => void;
  onCancel: () => void;
}

export function CreateConversionForm({ defaultVoltage, onCreated, onCancel }: Props) {
  const create = useCreateConversion();
  const { register, handleSubmit, setError, formState } = useForm({
    resolver: zodResolver(CreateConversionRequest),
    defaultValues: { systemVoltage: defaultVoltage as CreateConversionRequest['systemVoltage'] },
  });
  const errorOf = (path: string) => errorAt(formState.errors, path);

  const submit = handleSubmit((request) =>
    create.mutate(request, {
      onSuccess: ({ conversion }) => onCreated(conversion),
      onError: (err) => markServerIssues(err, setError),
    }),
  );

  return (
    <form
      onSubmit={(e) => void submit(e)}
      noValidate
      className="grid gap-4 rounded-lg border border-rule bg-paper-raised p-5 md:grid-cols-2"
    >
      <h2 className="text-lg font-semibold md:col-span-2">New conversion</h2>
      <TextField
        label="Name"
        required
        maxLength={120}
        {...register('name')}
        error={errorOf('name')}
        placeholder="e.g. customer or job name"
      />
      <SelectField
        label="System voltage"
        {...register('systemVoltage', { valueAsNumber: true })}
        error={errorOf('systemVoltage')}
      >
        <option value="12">12 V</option>
        <option value="24">24 V</option>
      </SelectField>
      <TextField
        label="Donor engine"
        required
        maxLength={120}
        {...register('donorEngine')}
        error={errorOf('donorEngine')}
      />
      <TextField
        label="Receiving vehicle"
        required
        maxLength={120}
        {...register('receivingVehicle')}
        error={errorOf('receivingVehicle')}
      />
      <div className="md:col-span-2">
        <TextAreaField
          label="Notes"
          maxLength={4000}
          {...register('notes', { setValueAs: blankAsUndefined })}
          error={errorOf('notes')}
        />
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
