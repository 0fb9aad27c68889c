import { useState } from 'react';
import type { z } from 'zod';
import { apiFieldError, zodFieldErrors } from './form-errors';

/**
 * A form's field errors, from the client-side check with the server's own schema or from the server's
 * answer: `check` answers the parsed input, or null after showing what is wrong.
 */
export function useFormCheck() {
  const [errors, setErrors] = useState<Record<string, string>>({});
  function check<S extends z.ZodType>(schema: S, input: unknown): z.output<S> | null {
    const parsed = schema.safeParse(input);
    if (!parsed.success) {
      setErrors(zodFieldErrors(parsed.error));
      return null;
    }
    setErrors({});
    return parsed.data;
  }
  return { errors, setErrors, check, fromServer: (err: unknown) => setErrors(apiFieldError(err)) };
}
