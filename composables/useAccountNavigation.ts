// Where to go after signing in, and the message of a failed API call.
import type { FetchError } from 'ofetch'

export interface WorkspaceChoice { slug: string, name: string, role: string }

/** A `next` query that stays on this site (a path, not `//host`), or null. */
export function safeNext(next: unknown): string | null {
  return typeof next === 'string' && next.startsWith('/') && !next.startsWith('//') ? next : null
}

export function apiMessage(error: unknown): string {
  const data = (error as FetchError)?.data as { message?: string } | undefined
  return data?.message || (error as Error)?.message || 'Something went wrong; try again.'
}

export function useAccountNavigation() {
  const route = useRoute()
  const { fetch: refreshSession } = useUserSession()
  /** Refreshes the client's view of the session, then opens `next` or the first workspace. */
  async function afterSignIn(workspaces: WorkspaceChoice[]) {
    await refreshSession()
    const next = safeNext(route.query.next)
    await navigateTo(next ?? (workspaces[0] ? `/w/${workspaces[0].slug}` : '/'))
  }
  return { afterSignIn }
}
