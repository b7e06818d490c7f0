import type { Role } from '#shared/utils/roles'

// UX only: send signed-out visitors to sign-in and keep roles off pages they cannot use.
// The server refuses the data anyway.
const PUBLIC_PAGES = ['/login', '/set-password', '/forgot-password']

declare module '#app' {
  interface PageMeta { roles?: Role[] }
}

export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  if (to.path === '/login' && loggedIn.value) return navigateTo(landingFor(user.value?.role))
  if (PUBLIC_PAGES.includes(to.path)) return
  if (!loggedIn.value) return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  const roles = to.meta.roles
  if (roles && user.value && !roles.includes(user.value.role)) return navigateTo(landingFor(user.value.role))
})
