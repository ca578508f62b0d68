// What a page showing one live board does: fetch the board, open it in the store as an empty
// document that the live server fills (the server holds the one true copy), and close it on leave.
// NOTE: the lifecycle hooks are registered before anything is awaited — after an await inside a
// composable Vue no longer knows the component, and the hooks would be lost. Callers await the result.
import type { BoardRecordInput } from '~/stores/board'

export function useLiveBoardPage(id: Ref<string>) {
  const fetched = useFetch<BoardRecordInput>(() => `/api/boards/${encodeURIComponent(id.value)}`)
  const { data, error } = fetched
  const store = useBoardStore()
  const live = useLiveBoard()
  function open() {
    if (!data.value || !import.meta.client) return
    store.openBoard(data.value, { live: true })
    live.start(data.value.id)
  }
  onMounted(open)
  watch(data, open)
  onBeforeUnmount(() => {
    live.stop()
    store.closeBoard()
  })
  return fetched.then(() => ({ data, error, store }))
}
