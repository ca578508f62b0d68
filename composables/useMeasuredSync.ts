// Keeps the measured files the open board names (its measured load, its blocks) fetched, so the
// board's results can use them. The caller passes the ids to follow and the fetcher (the board and
// measured stores): composables sit below stores and never import them.
import { watch } from 'vue'

export function useMeasuredSync(ids: () => readonly string[], ensure: (ids: readonly string[]) => unknown) {
  watch(ids, (next) => { if (import.meta.client && next.length) void ensure(next) }, { immediate: true })
}
