// Measured files the open board refers to (its .s1p load, its .s2p blocks), fetched from
// GET /api/uploads/:id and kept as plain parsed data; upload and parse errors for the UI.
import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import type { TwoPortData } from '#shared/rf'

/** A stored measured file as the API answers it (the parsed Touchstone data plus its name). */
export interface MeasuredFile extends TwoPortData {
  id: string
  fileName: string
  ports: number
  frequencies: number[]
}

/** What the upload route answers. */
export interface UploadSummary {
  id: string
  fileName: string
  ports: number
  frequencies: number
  fMinHz: number
  fMaxHz: number
}

/** A refused upload as shown to the user: the reason and, for a bad file, the line. */
export interface UploadProblem {
  fileName: string
  message: string
  line: number | null
}

interface FetchError { statusCode?: number, data?: { message?: string, data?: { line?: number | null } } }

export const useMeasuredStore = defineStore('measured', () => {
  const files = ref<Record<string, MeasuredFile>>({})
  const failed = ref<Record<string, string>>({})
  const isUploading = ref(false)
  const problem = ref<UploadProblem | null>(null)
  const lastUpload = ref<UploadSummary | null>(null)
  const pending = new Set<string>()

  /** Fetches the files not yet here (each once). */
  async function ensure(ids: readonly string[]) {
    await Promise.all(ids.filter(id => !files.value[id] && !pending.has(id)).map(async (id) => {
      pending.add(id)
      try {
        const file = await $fetch<MeasuredFile>(`/api/uploads/${id}`)
        files.value = { ...files.value, [id]: file }
      }
      catch (error) {
        failed.value = { ...failed.value, [id]: (error as FetchError).data?.message ?? String(error) }
      }
      finally {
        pending.delete(id)
      }
    }))
  }

  /** Uploads one file to the board; answers its summary, or null with `problem` set. */
  async function upload(boardId: string, file: File): Promise<UploadSummary | null> {
    const form = new FormData()
    form.append('file', file, file.name)
    isUploading.value = true
    problem.value = null
    try {
      const summary = await $fetch<UploadSummary>(`/api/boards/${boardId}/uploads`, { method: 'POST', body: form })
      lastUpload.value = summary
      await ensure([summary.id])
      return summary
    }
    catch (error) {
      const e = error as FetchError
      problem.value = {
        fileName: file.name,
        message: e.data?.message ?? 'The upload failed.',
        line: e.data?.data?.line ?? null,
      }
      return null
    }
    finally {
      isUploading.value = false
    }
  }

  function dismissProblem() {
    problem.value = null
  }

  return { files, failed, isUploading, problem, lastUpload, ensure, upload, dismissProblem }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useMeasuredStore, import.meta.hot))
