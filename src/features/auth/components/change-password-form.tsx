import { useState, type FormEvent } from 'react';
import { PASSWORD_MIN_CHARS, PASSWORD_RECOMMENDED_CHARS } from '#shared/auth/password-policy.ts';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { useChangePassword } from '../api/change-password.ts';

export function ChangePasswordForm() {
  const change = useChangePassword();
  const [mismatch, setMismatch] = useState(false);
  const errors = change.error instanceof ApiError ? change.error.fieldIssues() : {};

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget;
    const form = new FormData(formElement);
    const newPassword = String(form.get('newPassword'));
    if (newPassword !== String(form.get('repeatPassword'))) {
      setMismatch(true);
      return;
    }
    setMismatch(false);
    change.mutate(
      { currentPassword: String(form.get('currentPassword')), newPassword },
      { onSuccess: () => formElement.reset() },
    );
  }

  return (
    <form
      onSubmit={submit}
      noValidate
      className="flex max-w-md flex-col gap-4 rounded-lg border border-rule bg-paper-raised p-5"
    >
      <h2 className="text-lg font-semibold">Change your password</h2>
      <TextField
        label="Current password"
        name="currentPassword"
        type="password"
        autoComplete="current-password"
        error={errors.currentPassword}
      />
      <TextField
        label="New password"
        name="newPassword"
        type="password"
        autoComplete="new-password"
        error={errors.newPassword}
        hint={`At least ${PASSWORD_MIN_CHARS} characters; ${PASSWORD_RECOMMENDED_CHARS} or more is better. A short phrase works well.`}
      />
      <TextField
        label="New password again"
        name="repeatPassword"
        type="password"
        autoComplete="new-password"
        error={mismatch ? 'The two new passwords differ.' : undefined}
      />
      {change.isSuccess ? (
        <Notice tone="sound" title="Password changed">
          Other devices signed in as you have been signed out.
        </Notice>
      ) : null}
      {change.error && !Object.keys(errors).length ? (
        <Notice tone="fault" title="Password not changed">
          {change.error.message}
        </Notice>
      ) : null}
      <div>
        <Button type="submit" variant="primary" busy={change.isPending}>
          Change password
        </Button>
      </div>
    </form>
  );
}
