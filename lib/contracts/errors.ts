// Every error answer (lib/http.ts toErrorResponse): a code, a message, and per-field messages on 422.
import { z } from 'zod';

export const errorResponseSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fieldErrors: z.record(z.string(), z.array(z.string())).optional(),
    /** 1-based place of bad input in a stream (live samples), counted from the stream's first line */
    line: z.number().nullable().optional(),
    column: z.number().nullable().optional(),
  }),
});
export type ErrorResponse = z.infer<typeof errorResponseSchema>;
