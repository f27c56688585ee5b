import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { ConnectorFromTemplateRequest } from '#shared/schemas/library.schema.ts';
import {
  CONNECTOR_SIDE_LABELS,
  CONNECTOR_SIDES,
  type Connector,
} from '#shared/schemas/pin-map.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { blankAsUndefined, errorAt } from '@/lib/form-errors.ts';
import { useCreateConnectorFromTemplate } from '../api/create-connector-from-template.ts';
import { useTemplates } from '../api/get-templates.ts';
import { plural } from '@/lib/plural.ts';

/** Adds a connector to a conversion with a template's cavities, layout and pin details. */
export function FromTemplateForm({
  conversionId,
  onCreated,
}: {
  conversionId: number;
  onCreated?: (connector: Connector) => void;
}) {
  const templates = useTemplates();
  const create = useCreateConnectorFromTemplate(conversionId, onCreated);
  const serverIssues = create.error instanceof ApiError ? create.error.fieldIssues() : {};
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(ConnectorFromTemplateRequest),
  });
  const errorOf = (path: string) => errorAt(formState.errors, path);
  const submit = handleSubmit((request) => create.mutate(request));

  if (templates.isPending) return <Loading what="Loading the library" />;
  if (templates.isError) {
    return (
      <Notice tone="fault" title="The library could not be loaded">
        {templates.error.message}
      </Notice>
    );
  }
  return (
    <form
      onSubmit={(e) => void submit(e)}
      aria-label="Start a connector from a template"
      className="flex flex-col gap-3"
    >
      <SelectField
        label="Template"
        {...register('templateId', { valueAsNumber: true })}
        error={errorOf('templateId')}
      >
        {templates.data.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name} ({plural(t.cavityCount, 'cavity', 'cavities')}
            {t.builtIn ? ', built-in' : ''})
          </option>
        ))}
      </SelectField>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="New connector label"
          maxLength={40}
          placeholder="e.g. DLC"
          {...register('label')}
          error={errorOf('label') ?? serverIssues.label}
        />
        <SelectField label="Side" {...register('side', { setValueAs: blankAsUndefined })}>
          <option value="">As in the template</option>
          {CONNECTOR_SIDES.map((side) => (
            <option key={side} value={side}>
              {CONNECTOR_SIDE_LABELS[side]}
            </option>
          ))}
        </SelectField>
      </div>
      <div>
        <Button type="submit" busy={create.isPending}>
          Add connector from template
        </Button>
      </div>
      {create.isSuccess ? (
        <Notice tone="sound" title={`Added connector ${create.data.connector.label}`}>
          {plural(create.data.connector.cavityCount, 'cavity', 'cavities')} from the template, ready
          on the pin map.
        </Notice>
      ) : null}
      {create.isError && !serverIssues.label ? (
        <Notice tone="fault" title="The connector was not added">
          {create.error.message}
        </Notice>
      ) : null}
    </form>
  );
}
