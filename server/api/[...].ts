// Any /api path no route answers: a JSON 404, never the page renderer (whose sign-in guard
// answered anonymous callers with a 302 to /login, an HTML page a client cannot read).
export default defineEventHandler((event) => {
  throw createError({ statusCode: 404, message: `No API route ${event.method} ${event.path.split('?')[0]!.slice(0, 200)}.` })
})
