import { useState, type FormEvent } from 'react';
import { PASSWORD_MIN_CHARS, PASSWORD_RECOMMENDED_CHARS } from '#shared/auth/password-policy.ts';
import { ROLE_LABELS, ROLES } from '#shared/auth/roles.ts';
import { CreateUserRequest } from '#shared/schemas/users.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useCreateUser } from '../api/users.ts';

export function CreateUserForm() {
  const create = useCreateUser();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [added, setAdded] = useState<string | null>(null);

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget;
    const form = new FormData(formElement);
    const parsed = CreateUserRequest.safeParse({
      name: form.get('name'),
      email: form.get('email'),
      role: form.get('role'),
      password: form.get('password') || undefined,
    });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: ({ user }) => {
        setAdded(
          parsed.data.password
            ? `${user.name} can now sign in as ${ROLE_LABELS[user.role].toLowerCase()}.`
            : `${user.name} has been e-mailed an invitation to set a password.`,
        );
        formElement.reset();
      },
      onError: (err) => err instanceof ApiError && setErrors(err.fieldIssues()),
    });
  }

  return (
    <form
      onSubmit={submit}
      noValidate
      className="grid gap-4 rounded-lg border border-rule bg-paper-raised p-5 md:grid-cols-2"
    >
      <h2 className="text-lg font-semibold md:col-span-2">Add a person</h2>
      <TextField label="Name" name="name" required error={errors.name} autoComplete="off" />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        required
        error={errors.email}
        autoComplete="off"
      />
      <SelectField label="Role" name="role" defaultValue="builder" error={errors.role}>
        {ROLES.map((role) => (
          <option key={role} value={role}>
            {ROLE_LABELS[role]}
          </option>
        ))}
      </SelectField>
      <TextField
        label="First password (optional)"
        name="password"
        type="password"
        autoComplete="new-password"
        error={errors.password}
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
