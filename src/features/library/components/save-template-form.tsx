import { useState, type FormEvent } from 'react';
import { SaveTemplateRequest } from '#shared/schemas/library.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useSaveTemplate } from '../api/save-template.ts';
import type { ConnectorChoice } from '../lib/connector-choice.ts';

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
  const [errors, setErrors] = useState<Record<string, string>>({});
  const serverIssues = save.error instanceof ApiError ? save.error.fieldIssues() : {};

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const element = event.currentTarget;
    const form = new FormData(element);
    const parsed = SaveTemplateRequest.safeParse({
      connectorId: Number(form.get('connectorId')),
      name: form.get('name'),
      description: form.get('description') || undefined,
    });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    save.mutate(parsed.data, { onSuccess: () => element.reset() });
  }

  if (connectors.length === 0) {
    return <p className="text-sm text-ink-faint">This conversion has no connectors to save yet.</p>;
  }
  return (
    <form
      onSubmit={submit}
      aria-label="Save a connector as a template"
      className="flex flex-col gap-3"
    >
      <SelectField
        label="Connector to save"
        name="connectorId"
        defaultValue={defaultConnectorId ? String(defaultConnectorId) : undefined}
        key={defaultConnectorId}
        error={errors.connectorId}
      >
        {connectors.map((c) => (
          <option key={c.id} value={c.id}>
            {c.label} — {c.detail}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Template name"
        name="name"
        maxLength={120}
        placeholder="e.g. KT-20 ECU connector 2"
        error={errors.name ?? serverIssues.name}
      />
      <TextField label="Description (optional)" name="description" maxLength={2000} />
      <div>
        <Button type="submit" busy={save.isPending}>
          Save to the library
        </Button>
      </div>
      {save.isSuccess ? (
        <Notice tone="sound" title={`Saved “${save.data.template.name}” to the library`}>
          {save.data.template.cavityCount} cavities with their wires and decisions.
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
