import type { RequestHandler } from 'express'
import type { z } from 'zod'
import { badRequest, zodDetails, type ErrorDetail } from './errors'

export { zodDetails } from './errors'

interface Schemas {
  params?: z.ZodType
  query?: z.ZodType
  body?: z.ZodType
}

export type Input<S extends Schemas> = {
  [K in keyof S]: S[K] extends z.ZodType ? z.output<S[K]> : never
}

/** Paths of every string holding a NUL (PostgreSQL text cannot store one), `query.entity` style. */
export function nulPaths(value: unknown, path: string, out: string[] = []): string[] {
  if (typeof value === 'string') {
    if (value.includes('\u0000')) out.push(path)
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => nulPaths(v, `${path}.${i}`, out))
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (k.includes('\u0000')) out.push(`${path}.${k.replaceAll('\u0000', '\\0')}`)
      nulPaths(v, `${path}.${k}`, out)
    }
  }
  return out
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
      const nul = nulPaths(req[part], part)
      if (nul.length) {
        details.push(...nul.map((path) => ({ path, message: 'contains a NUL character' })))
        continue
      }
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
