// Pages need a signed-in user except the landing page, the account forms and mailed links.
const PUBLIC_PATHS = new Set(['/', '/login', '/signup', '/forgot'])
const PUBLIC_PREFIXES = ['/reset/', '/invite/']

export default defineNuxtRouteMiddleware((to) => {
  if (PUBLIC_PATHS.has(to.path) || PUBLIC_PREFIXES.some(prefix => to.path.startsWith(prefix))) return
  const { loggedIn } = useUserSession()
  if (!loggedIn.value) return navigateTo({ path: '/login', query: { next: to.fullPath } })
})
