import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { PASSWORD_MIN_CHARS, PASSWORD_RECOMMENDED_CHARS } from '#shared/auth/password-policy.ts';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { useSetPassword } from '@/features/auth/api/set-password.ts';
import { ApiError } from '@/lib/api-client.ts';
import mark from '@/assets/loomwright-mark.svg';

/** Where an invitation link lands: the token is in the fragment, so it never reaches a server log. */
export function SetPasswordRoute() {
  const [token] = useState(
    () => new URLSearchParams(window.location.hash.slice(1)).get('token') ?? '',
  );
  const setPassword = useSetPassword();
  const navigate = useNavigate();
  const [mismatch, setMismatch] = useState(false);
  const fieldErrors = setPassword.error instanceof ApiError ? setPassword.error.fieldIssues() : {};

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const password = String(form.get('password'));
    if (password !== String(form.get('repeat'))) {
      setMismatch(true);
      return;
    }
    setMismatch(false);
    setPassword.mutate(
      { token, password },
      { onSuccess: () => navigate(paths.conversions.getHref(), { replace: true }) },
    );
  }

  return (
    <div className="grid min-h-screen place-items-center px-4">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-3">
          <img src={mark} alt="" className="size-11" />
          <h1 className="text-2xl font-bold tracking-tight">Set your password</h1>
        </div>
        {!token ? (
          <Notice tone="fault" title="This link is incomplete">
            Open the link from your invitation e-mail again, or ask the workshop admin for a new
            one.
          </Notice>
        ) : (
          <form
            onSubmit={submit}
            className="flex flex-col gap-4 rounded-lg border border-rule bg-paper-raised p-6"
          >
            <TextField
              label="New password"
              name="password"
              type="password"
              autoComplete="new-password"
              error={fieldErrors.password}
              hint={`At least ${PASSWORD_MIN_CHARS} characters; ${PASSWORD_RECOMMENDED_CHARS} or more is better.`}
            />
            <TextField
              label="Again"
              name="repeat"
              type="password"
              autoComplete="new-password"
              error={mismatch ? 'The two passwords differ.' : undefined}
            />
            {setPassword.error && !fieldErrors.password ? (
              <Notice tone="fault" title="Password not set">
                {setPassword.error.message}
              </Notice>
            ) : null}
            <Button type="submit" variant="primary" busy={setPassword.isPending}>
              Set password and sign in
            </Button>
          </form>
        )}
      </div>
    </div>
  );
}
