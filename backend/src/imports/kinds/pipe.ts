import { z } from 'zod'

/**
 * Validates a converted row with the API's own schema inside a transform, so an import row and a
 * posted body pass exactly the same rules; the issues keep their field paths.
 */
export function validateWith<T>(schema: z.ZodType<T>, value: unknown, ctx: z.RefinementCtx): T {
  const out = schema.safeParse(value)
  if (out.success) return out.data
  for (const issue of out.error.issues) {
    ctx.addIssue({
      code: 'custom',
      path: issue.path as (string | number)[],
      message: issue.message,
    })
  }
  return z.NEVER
}
