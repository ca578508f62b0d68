// POST /api/rf/search — the broadband match search (searchMatches) in a worker thread.
// Signed-in callers only (any role, reviewers included): one search costs up to a core-second.
// 400 names the bad field; 503 with a message when the search runs past its time limit.
export default defineEventHandler(async (event) => {
  await requireUserSession(event)
  refuseDeclaredOversize(event, RF_MAX_BODY_BYTES)
  const body = await readBodyAs(event, SearchBodySchema)
  return withNonFiniteAsStrings(await searchOffThread(body))
})
