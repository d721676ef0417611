// Server errors on forms: a 422 answer carries per-field messages (lib/http.ts toErrorResponse, keyed by the zod path,
// e.g. "name" or "checks.0.expected"); each goes onto its field with react-hook-form's setError, so every form shows
// the server's field errors exactly like its own validation. What has no field on the form comes back as one line.
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/fetcher';

export interface ServerErrorOptions {
  /** the form's top-level field names: a server path whose first segment is one of them goes onto that field */
  fields: readonly string[];
  /** server path -> form path, for a form whose fields are named differently from the request body (e.g. labels.club -> club) */
  rename?: (path: string) => string;
  /** the line for an error that is not an ApiError (network down, a bug) */
  fallback: string;
}

/**
 * Puts the server's field errors on their fields and returns the message for the form as a whole: the server's
 * message plus any field error without a field on this form, or null when every field error found its field.
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, options: ServerErrorOptions): string | null {
  if (!(error instanceof ApiError)) return options.fallback;
  const entries = Object.entries(error.fieldErrors);
  if (entries.length === 0) return error.message;
  const unplaced: string[] = [];
  for (const [serverPath, messages] of entries) {
    const path = options.rename ? options.rename(serverPath) : serverPath;
    const top = path.split('.')[0];
    if (options.fields.includes(top)) setError(path as Path<T>, { type: 'server', message: messages[0] });
    else unplaced.push(`${serverPath}: ${messages.join(' ')}`);
  }
  return unplaced.length > 0 ? `${error.message} ${unplaced.join('; ')}` : null;
}

/** The same for a control that is not a react-hook-form form: the server's message with every field error, one line. */
export function serverErrorText(error: unknown, fallback: string): string {
  return applyServerErrors(error, () => undefined, { fields: [], fallback }) ?? fallback;
}
