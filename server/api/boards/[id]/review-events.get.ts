// The board's review as an event stream: one `review` event each time a comment, reply, edit,
// deletion, resolution or verdict lands, so open browsers fetch the list again without a reload.
export default defineEventHandler(async (event) => {
  const { id } = await paramsAs(event, IdParams)
  await requireMember(event, { boardId: id }, 'reviewer')
  const stream = createEventStream(event)
  const stop = onReviewEvent(id, (e) => { void stream.push({ event: 'review', data: JSON.stringify(e) }) })
  // A comment line every 25 s keeps proxies from closing an idle stream.
  const keepAlive = setInterval(() => { void stream.pushComment('keep-alive') }, 25_000)
  stream.onClosed(async () => {
    stop()
    clearInterval(keepAlive)
    await stream.close()
  })
  void stream.push({ event: 'ready', data: '{}' })
  return stream.send()
})
