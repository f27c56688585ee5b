import { useId, type ComponentProps, type ReactNode } from 'react';

const CONTROL =
  'w-full rounded-md border border-rule-strong bg-paper-raised px-3 py-2 text-ink placeholder:text-ink-faint aria-[invalid=true]:border-fault';

interface FieldShellProps {
  label: string;
  error?: string;
  hint?: ReactNode;
  id: string;
  children: ReactNode;
}

function FieldShell({ label, error, hint, id, children }: FieldShellProps) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-ink-soft">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-sm text-fault">
          <span aria-hidden>✕ </span>
          {error}
        </p>
      ) : null}
    </div>
  );
}

// ComponentProps, not the bare attributes: they carry `ref`, so a form library can register a field.
type TextFieldProps = ComponentProps<'input'> & {
  label: string;
  error?: string;
  hint?: ReactNode;
};

export function TextField({ label, error, hint, id, className = '', ...rest }: TextFieldProps) {
  const generated = useId();
  const fieldId = id ?? generated;
  return (
    <FieldShell label={label} error={error} hint={hint} id={fieldId}>
      <input
        id={fieldId}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${fieldId}-error` : hint ? `${fieldId}-hint` : undefined}
        className={`${CONTROL} ${className}`}
        {...rest}
      />
    </FieldShell>
  );
}

type SelectFieldProps = ComponentProps<'select'> & {
  label: string;
  error?: string;
  hint?: ReactNode;
};

export function SelectField({
  label,
  error,
  hint,
  id,
  className = '',
  children,
  ...rest
}: SelectFieldProps) {
  const generated = useId();
  const fieldId = id ?? generated;
  return (
    <FieldShell label={label} error={error} hint={hint} id={fieldId}>
      <select
        id={fieldId}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${fieldId}-error` : hint ? `${fieldId}-hint` : undefined}
        className={`${CONTROL} ${className}`}
        {...rest}
      >
        {children}
      </select>
    </FieldShell>
  );
}

type TextAreaFieldProps = ComponentProps<'textarea'> & {
  label: string;
  error?: string;
  hint?: ReactNode;
};

export function TextAreaField({
  label,
  error,
  hint,
  id,
  className = '',
  ...rest
}: TextAreaFieldProps) {
  const generated = useId();
  const fieldId = id ?? generated;
  return (
    <FieldShell label={label} error={error} hint={hint} id={fieldId}>
      <textarea
        id={fieldId}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${fieldId}-error` : hint ? `${fieldId}-hint` : undefined}
        className={`${CONTROL} min-h-20 ${className}`}
        {...rest}
      />
    </FieldShell>
  );
}
