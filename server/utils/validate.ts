// Zod validation for route inputs: a 400 whose message names the offending field, and the full
// list of issues in `data` for clients that want every problem at once.
import type { H3Event } from 'h3'
import type { z } from 'zod'

export function describeIssues(error: z.ZodError): string {
  return error.issues
    .slice(0, 3)
    .map(issue => `${issue.path.length ? issue.path.join('.') : 'body'}: ${issue.message}`)
    .join('; ')
}

function fail(error: z.ZodError, where: string): never {
  throw createError({
    statusCode: 400,
    message: `Invalid ${where}: ${describeIssues(error)}`,
    data: { issues: error.issues.map(i => ({ path: i.path.join('.'), message: i.message })) },
  })
}

export async function readBodyAs<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  let raw: unknown
  try {
    raw = await readBody(event)
  }
  catch {
    throw createError({ statusCode: 400, message: 'Malformed JSON body: the request body could not be parsed.' })
  }
  const parsed = schema.safeParse(raw ?? {})
  if (!parsed.success) fail(parsed.error, 'body')
  return parsed.data
}

export async function queryAs<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  const parsed = schema.safeParse(getQuery(event))
  if (!parsed.success) fail(parsed.error, 'query')
  return parsed.data
}

export async function paramsAs<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  const parsed = schema.safeParse(getRouterParams(event, { decode: true }))
  if (!parsed.success) fail(parsed.error, 'path parameter')
  return parsed.data
}
