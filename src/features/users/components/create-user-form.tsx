import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { PASSWORD_MIN_CHARS, PASSWORD_RECOMMENDED_CHARS } from '#shared/auth/password-policy.ts';
import { ROLE_LABELS, ROLES } from '#shared/auth/roles.ts';
import { CreateUserRequest } from '#shared/schemas/users.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { blankAsUndefined, errorAt, markServerIssues } from '@/lib/form-errors.ts';
import { useCreateUser } from '../api/users.ts';

export function CreateUserForm() {
  const create = useCreateUser();
  const [added, setAdded] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm({
    resolver: zodResolver(CreateUserRequest),
    defaultValues: { role: 'builder' as const },
  });
  const errorOf = (path: string) => errorAt(formState.errors, path);

  const submit = handleSubmit((request) =>
    create.mutate(request, {
      onSuccess: ({ user }) => {
        setAdded(
          request.password
            ? `${user.name} can now sign in as ${ROLE_LABELS[user.role].toLowerCase()}.`
            : `${user.name} has been e-mailed an invitation to set a password.`,
        );
        reset();
      },
      onError: (err) => markServerIssues(err, setError),
    }),
  );

  return (
    <form
      onSubmit={(e) => void submit(e)}
      noValidate
      className="grid gap-4 rounded-lg border border-rule bg-paper-raised p-5 md:grid-cols-2"
    >
      <h2 className="text-lg font-semibold md:col-span-2">Add a person</h2>
      <TextField
        label="Name"
        required
        {...register('name')}
        error={errorOf('name')}
        autoComplete="off"
      />
      <TextField
        label="E-mail"
        type="email"
        required
        {...register('email')}
        error={errorOf('email')}
        autoComplete="off"
      />
      <SelectField label="Role" {...register('role')} error={errorOf('role')}>
        {ROLES.map((role) => (
          <option key={role} value={role}>
            {ROLE_LABELS[role]}
          </option>
        ))}
      </SelectField>
      <TextField
        label="First password (optional)"
        type="password"
        autoComplete="new-password"
        {...register('password', { setValueAs: blankAsUndefined })}
        error={errorOf('password')}
        hint={`Leave empty to e-mail them an invitation to set their own. Otherwise at least ${PASSWORD_MIN_CHARS} characters, ${PASSWORD_RECOMMENDED_CHARS} or more recommended.`}
      />
      {create.error &&
      !(create.error instanceof ApiError && Object.keys(create.error.fieldIssues()).length) ? (
        <div className="md:col-span-2">
          <Notice tone="fault" title="Not added">
            {create.error.message}
          </Notice>
        </div>
      ) : null}
      {added ? (
        <div className="md:col-span-2">
          <Notice tone="sound" title="Added">
            {added}
          </Notice>
        </div>
      ) : null}
      <div className="md:col-span-2">
        <Button type="submit" variant="primary" busy={create.isPending}>
          Add person
        </Button>
      </div>
    </form>
  );
}
