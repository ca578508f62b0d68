// What a page showing one live board does: fetch the board, open it in the store as an empty
// document that the live server fills (the server holds the one true copy), and close it on leave.
// NOTE: the lifecycle hooks are registered before anything is awaited — after an await inside a
// composable Vue no longer knows the component, and the hooks would be lost. Callers await the result.
// The store comes from the page (composables sit below stores and never import them).
import type { BoardRecordInput } from '#shared/types/api'
import type { LiveBoardTarget } from './useLiveBoard'

/** What the page's board store must offer to hold a live board. */
export interface LiveBoardHolder extends LiveBoardTarget {
  openBoard(record: BoardRecordInput, options: { live: boolean }): void
  closeBoard(): void
}

export function useLiveBoardPage<S extends LiveBoardHolder>(id: Ref<string>, store: S) {
  const fetched = useFetch<BoardRecordInput>(() => `/api/boards/${encodeURIComponent(id.value)}`)
  const { data, error } = fetched
  const live = useLiveBoard()
  function open() {
    if (!data.value || !import.meta.client) return
    store.openBoard(data.value, { live: true })
    live.start(data.value.id, store)
  }
  onMounted(open)
  watch(data, open)
  onBeforeUnmount(() => {
    live.stop()
    store.closeBoard()
  })
  return fetched.then(() => ({ data, error, store }))
}
