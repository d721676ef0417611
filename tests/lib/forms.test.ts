import { describe, expect, it } from 'vitest';
import { ApiError } from '@/lib/fetcher';
import { applyServerErrors, serverErrorText } from '@/lib/forms';

// applyServerErrors: a 422's per-field messages (lib/http.ts puts the zod path in fieldErrors) land on the form's
// fields; what has no field on the form, and any other error, becomes the form's one message.
function recorder() {
  const set: Record<string, string | undefined> = {};
  return { set, setError: (name: string, error: { message?: string }) => void (set[name] = error.message) };
}

describe('applyServerErrors', () => {
  it('puts each field error on its field (nested paths included) and leaves no form message', () => {
    const { set, setError } = recorder();
    const error = new ApiError(422, 'Check the highlighted fields.', { name: ['Give the target a name.'], 'checks.0.expected': ['Expected must be at most 150.', 'second'] });
    expect(applyServerErrors(error, setError, { fields: ['name', 'checks'], fallback: 'Could not save.' })).toBeNull();
    expect(set).toEqual({ name: 'Give the target a name.', 'checks.0.expected': 'Expected must be at most 150.' });
  });

  it('renames server paths to form fields, and reports the ones the form has no field for', () => {
    const { set, setError } = recorder();
    const error = new ApiError(422, 'Check the labels.', { 'labels.club': ['Choose a club from the list.'], events: ['Unknown event.'] });
    const message = applyServerErrors(error, setError, { fields: ['club'], rename: (p) => p.replace(/^labels\./, ''), fallback: 'x' });
    expect(set).toEqual({ club: 'Choose a club from the list.' });
    expect(message).toBe('Check the labels. events: Unknown event.');
  });

  it('an ApiError without field errors is its message; anything else is the fallback', () => {
    const { set, setError } = recorder();
    expect(applyServerErrors(new ApiError(404, 'No athlete with this id.'), setError, { fields: [], fallback: 'x' })).toBe('No athlete with this id.');
    expect(applyServerErrors(new TypeError('Failed to fetch'), setError, { fields: [], fallback: 'Could not save.' })).toBe('Could not save.');
    expect(set).toEqual({});
  });

  it('serverErrorText: one line with every field error, for controls outside react-hook-form', () => {
    expect(serverErrorText(new ApiError(422, 'Check the due date.', { dueDate: ['Not a real date.'] }), 'x')).toBe('Check the due date. dueDate: Not a real date.');
    expect(serverErrorText(new Error('boom'), 'Could not assign the drill.')).toBe('Could not assign the drill.');
  });
});
