// Writes to /api/swings/:id and its annotations, through lib/fetcher.ts (zod-checked answers, ApiError with the
// server's field errors on 422).
import { ApiError, deleteJson, sendJson } from '@/lib/fetcher';
import type { EventName } from '@/lib/signal/types';
import { annotationResponseSchema, swingViewResponseSchema, type Annotation, type SwingLabels } from '@/lib/contracts/swings';

export const swingUrl = (id: number) => `/api/swings/${id}`;

export interface SwingPatch {
  events?: Partial<Record<EventName, number>>;
  resetEvents?: EventName[] | 'all';
  labels?: Partial<SwingLabels>;
}

export const patchSwing = (id: number, body: SwingPatch) => sendJson(swingUrl(id), 'PATCH', body, swingViewResponseSchema);

export type AnnotationInput = Pick<Annotation, 'body' | 'visibility'> & { timeS?: number | null; phase?: Annotation['phase'] };

export const createAnnotation = (swingId: number, body: AnnotationInput) =>
  sendJson(`${swingUrl(swingId)}/annotations`, 'POST', body, annotationResponseSchema);

export const updateAnnotation = (swingId: number, annotationId: number, body: Partial<AnnotationInput>) =>
  sendJson(`${swingUrl(swingId)}/annotations/${annotationId}`, 'PATCH', body, annotationResponseSchema);

/** Undo of a removal: the same note back (the server keeps removed notes in the bin). */
export const restoreAnnotation = (swingId: number, annotationId: number) =>
  sendJson(`${swingUrl(swingId)}/annotations/${annotationId}/restore`, 'POST', undefined, annotationResponseSchema);

/** DELETE answers 204 with no body; the note goes to the bin. */
export async function deleteAnnotation(swingId: number, annotationId: number): Promise<void> {
  await deleteJson(`${swingUrl(swingId)}/annotations/${annotationId}`);
}

/** One line for an error: the server's message plus its field errors ("events.top: ..."). */
export function errorText(error: unknown): string {
  if (error instanceof ApiError) {
    const fields = Object.entries(error.fieldErrors).map(([field, msgs]) => `${field}: ${msgs.join(' ')}`);
    return fields.length ? `${error.message} ${fields.join('; ')}` : error.message;
  }
  return error instanceof Error ? error.message : 'Something went wrong.';
}
