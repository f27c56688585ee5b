/**
 * The forms' one way from an error to the marks beside their fields. The form library
 * (react-hook-form with the zod resolver) marks what the shared schema refuses before sending;
 * the server's 400 names its fields in the same words, and lands beside the same fields here.
 */
import {
  get,
  useFormState,
  type FieldErrors,
  type FieldPath,
  type FieldValues,
  type UseFormSetError,
} from 'react-hook-form';
import { ApiError } from './api-client.ts';

/** The message at a field's path ("wire.sizeMm2", "loads.0.currentA"), if there is one. */
export function errorAt(errors: FieldErrors, path: string): string | undefined {
  const error = get(errors, path) as
    { message?: unknown; root?: { message?: unknown } } | undefined;
  const message = error?.message ?? error?.root?.message;
  return typeof message === 'string' && message ? message : undefined;
}

/**
 * Marks the fields a server's answer names; returns those issues (empty when the answer named
 * none, or was not the API's), so the form can tell in words what it has no field for.
 */
export function markServerIssues<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
): Record<string, string> {
  if (!(error instanceof ApiError)) return {};
  const issues = error.fieldIssues();
  for (const [field, message] of Object.entries(issues)) {
    // The server's path may be one the form has no value for (e.g. "wire.sizeMm2"): the mark
    // still goes there, and errorAt finds it.
    setError(field as FieldPath<T>, { type: 'server', message });
  }
  return issues;
}

/**
 * Inside a form: a reader of the marks by path. Reading the errors here subscribes the form to
 * them, so the fields show a mark as soon as it is set.
 */
export function useErrorOf(): (path: string) => string | undefined {
  const { errors } = useFormState();
  return (path) => errorAt(errors, path);
}

/** For `register(name, { setValueAs })`: an empty field sends nothing, as the schemas expect. */
export const blankAsUndefined = (value: unknown) => (value === '' ? undefined : value);

/**
 * For a form that shows a mutation's failure itself: the mark beside each field (the form's own,
 * else the one the server's answer names for that path), and the failure in words when the answer
 * named no field.
 */
export function marksOf(
  errors: FieldErrors,
  error: Error | null,
): { errorOf: (path: string) => string | undefined; unplaced: string | null } {
  const server = error instanceof ApiError ? error.fieldIssues() : {};
  return {
    errorOf: (path) => errorAt(errors, path) ?? server[path],
    unplaced: error && Object.keys(server).length === 0 ? error.message : null,
  };
}
