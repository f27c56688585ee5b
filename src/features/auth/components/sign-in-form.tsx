import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useSignIn } from '../api/sign-in.ts';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const [missing, setMissing] = useState<Record<string, string>>({});

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const email = String(form.get('email') ?? '').trim();
    const password = String(form.get('password') ?? '');
    const problems: Record<string, string> = {};
    if (!email) problems.email = 'Enter your e-mail address.';
    if (!password) problems.password = 'Enter your password.';
    setMissing(problems);
    if (Object.keys(problems).length) return;
    signIn.mutate({ email, password }, { onSuccess: onSignedIn });
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="username"
        autoFocus
        error={missing.email}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        error={missing.password}
      />
      {signIn.error ? (
        <Notice tone="fault" title="Not signed in">
          {signIn.error.message}
        </Notice>
      ) : null}
      <Button type="submit" variant="primary" busy={signIn.isPending}>
        Sign in
      </Button>
    </form>
  );
}
