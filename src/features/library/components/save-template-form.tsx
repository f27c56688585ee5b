import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { SaveTemplateRequest } from '#shared/schemas/library.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { blankAsUndefined, errorAt } from '@/lib/form-errors.ts';
import { useSaveTemplate } from '../api/save-template.ts';
import type { ConnectorChoice } from '../lib/connector-choice.ts';
import { plural } from '@/lib/plural.ts';

/**
 * Saves one connector's pinout to the workshop library: cavities, face layout and each pin's
 * function, signal class, wire and decision (not its destination, which belongs to one job).
 */
export function SaveTemplateForm({
  connectors,
  defaultConnectorId,
}: {
  connectors: ConnectorChoice[];
  defaultConnectorId?: number;
}) {
  const save = useSaveTemplate();
  const serverIssues = save.error instanceof ApiError ? save.error.fieldIssues() : {};
  const { register, handleSubmit, setValue, reset, formState } = useForm({
    resolver: zodResolver(SaveTemplateRequest),
    defaultValues: { connectorId: defaultConnectorId },
  });
  const errorOf = (path: string) => errorAt(formState.errors, path);
  // A connector chosen elsewhere on the page (its card's "save as template") is preselected.
  useEffect(() => {
    if (defaultConnectorId) setValue('connectorId', defaultConnectorId);
  }, [defaultConnectorId, setValue]);

  const submit = handleSubmit((request) => save.mutate(request, { onSuccess: () => reset() }));

  if (connectors.length === 0) {
    return <p className="text-sm text-ink-faint">This conversion has no connectors to save yet.</p>;
  }
  return (
    <form
      onSubmit={(e) => void submit(e)}
      aria-label="Save a connector as a template"
      className="flex flex-col gap-3"
    >
      <SelectField
        label="Connector to save"
        {...register('connectorId', { valueAsNumber: true })}
        error={errorOf('connectorId')}
      >
        {connectors.map((c) => (
          <option key={c.id} value={c.id}>
            {c.label} — {c.detail}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Template name"
        maxLength={120}
        placeholder="e.g. KT-20 ECU connector 2"
        {...register('name')}
        error={errorOf('name') ?? serverIssues.name}
      />
      <TextField
        label="Description (optional)"
        maxLength={2000}
        {...register('description', { setValueAs: blankAsUndefined })}
      />
      <div>
        <Button type="submit" busy={save.isPending}>
          Save to the library
        </Button>
      </div>
      {save.isSuccess ? (
        <Notice tone="sound" title={`Saved “${save.data.template.name}” to the library`}>
          {plural(save.data.template.cavityCount, 'cavity', 'cavities')} with their wires and
          decisions.
        </Notice>
      ) : null}
      {save.isError && !serverIssues.name ? (
        <Notice tone="fault" title="The template was not saved">
          {save.error.message}
        </Notice>
      ) : null}
    </form>
  );
}
