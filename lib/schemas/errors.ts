import { z } from 'zod';

/** The one error shape of every endpoint (see DEVELOPERS.md), with its HTTP status. */
export const apiErrorStatus = {
  VALIDATION_FAILED: 400,
  UNAUTHENTICATED: 401,
  FORBIDDEN: 403,
  NOT_FOUND: 404,
  CONFLICT: 409,
  PAYLOAD_TOO_LARGE: 413,
  UNSUPPORTED_MEDIA: 415,
  RATE_LIMITED: 429,
  INTERNAL: 500,
  UNAVAILABLE: 503,
} as const;

export type ApiErrorCode = keyof typeof apiErrorStatus;

export const apiErrorCodeSchema = z.enum(
  Object.keys(apiErrorStatus) as [ApiErrorCode, ...ApiErrorCode[]],
);

export const apiErrorBodySchema = z.object({
  error: z.object({
    code: apiErrorCodeSchema,
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});

export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;
