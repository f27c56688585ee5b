import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { CreateBoxRequest } from '#shared/schemas/harness.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/field.tsx';
import { marksOf } from '@/lib/form-errors.ts';

/** A new, empty relay and fuse box; its fuses and relays are added as positions after. */
export function AddBoxForm({
  busy,
  error,
  onSubmit,
  onCancel,
}: {
  busy: boolean;
  error: Error | null;
  onSubmit: (values: CreateBoxRequest) => void;
  onCancel: () => void;
}) {
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(CreateBoxRequest),
    defaultValues: { label: '', notes: '', positions: [] },
  });
  const { errorOf, unplaced } = marksOf(formState.errors, error);
  const submit = handleSubmit(onSubmit);
  return (
    <form
      aria-label="Add a box"
      onSubmit={(e) => void submit(e)}
      className="grid items-end gap-3 rounded-lg border border-rule bg-paper-raised p-4 sm:grid-cols-[1fr_2fr_auto]"
    >
      <h2 className="font-semibold sm:col-span-3">Add a relay and fuse box</h2>
      <TextField
        label="Name"
        placeholder="Engine bay box"
        {...register('label')}
        error={errorOf('label')}
      />
      <TextField label="Where it sits" {...register('notes')} error={errorOf('notes')} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={busy}>
          Add box
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      {unplaced ? (
        <p role="alert" className="text-sm text-fault sm:col-span-3">
          {unplaced}
        </p>
      ) : null}
    </form>
  );
}
