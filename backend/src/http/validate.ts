import type { RequestHandler } from 'express'
import type { z } from 'zod'
import { badRequest, type ErrorDetail } from './errors'

interface Schemas {
  params?: z.ZodType
  query?: z.ZodType
  body?: z.ZodType
}

export type Input<S extends Schemas> = {
  [K in keyof S]: S[K] extends z.ZodType ? z.output<S[K]> : never
}

/** Turns zod issues into `{ path, message }` with the request part first (`body.stations.3.depth`). */
export function zodDetails(part: string, error: z.ZodError): ErrorDetail[] {
  return error.issues.map((issue) => ({
    path: [part, ...issue.path.map(String)].join('.'),
    message: issue.message,
  }))
}

/**
 * Validates params, query and body with zod and keeps the parsed values on `res.locals.input`
 * (Express 5's req.query is read-only). Any failure → 400 naming every bad field.
 */
export function validate<S extends Schemas>(schemas: S): RequestHandler {
  return (req, res, next) => {
    const input: Record<string, unknown> = {}
    const details: ErrorDetail[] = []
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part]
      if (!schema) continue
      const result = schema.safeParse(req[part] ?? {})
      if (result.success) input[part] = result.data
      else details.push(...zodDetails(part, result.error))
    }
    if (details.length > 0) {
      const fields = details.map((d) => d.path).join(', ')
      throw badRequest(`Invalid input: ${fields}`, details)
    }
    res.locals.input = input
    next()
  }
}

/** Reads what `validate` parsed, typed by the same schemas. */
export function inputOf<S extends Schemas>(res: { locals: Record<string, unknown> }, _schemas: S) {
  return res.locals.input as Input<S>
}
