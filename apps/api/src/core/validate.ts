import type { z } from 'zod';

/** Parses untrusted input with a shared schema; a ZodError becomes a 400 with field errors. */
export function parse<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  return schema.parse(input ?? {});
}
