// Keeps the measured files the open board names (its measured load, its blocks) fetched into the
// measured store, so the board store's results can use them.
import { watch } from 'vue'
import { useBoardStore } from '~/stores/board'
import { useMeasuredStore } from '~/stores/measured'

export function useMeasuredSync() {
  const board = useBoardStore()
  const measured = useMeasuredStore()
  watch(() => board.measuredIds, (ids) => { if (import.meta.client && ids.length) void measured.ensure(ids) }, { immediate: true })
}
