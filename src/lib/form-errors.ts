import type { z } from 'zod';
import { ApiError } from './api-client';

/** Field → message from a zod error (client-side check with the server's own schema). */
export function zodFieldErrors(err: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of err.issues) {
    const k = i.path.map(String).join('.') || '_';
    if (!out[k]) out[k] = i.message;
  }
  return out;
}

/** Field → message from a server error that names its field. */
export function apiFieldError(err: unknown): Record<string, string> {
  if (err instanceof ApiError && err.field) return { [err.field]: err.message.replace(new RegExp(`^${err.field}: `), '') };
  return {};
}
