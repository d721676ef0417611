// Every error answer (lib/http.ts toErrorResponse): a code, a message, and per-field messages on 422.
import { z } from 'zod';

export const errorResponseSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fieldErrors: z.record(z.string(), z.array(z.string())).optional(),
  }),
});
export type ErrorResponse = z.infer<typeof errorResponseSchema>;
