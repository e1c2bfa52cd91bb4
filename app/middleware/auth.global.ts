import type { Role } from '#shared/domain/enums'

// Pages need a signed-in user, except the sign-in page; a page may also name
// the roles it serves (definePageMeta({ roles })). This only guides the
// browser: the server checks every request itself.
export default defineNuxtRouteMiddleware(async (to) => {
  const { loggedIn, user } = useUserSession()
  if (to.meta.public) return
  if (!loggedIn.value) {
    return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  }
  const roles = to.meta.roles as Role[] | undefined
  if (roles && user.value && !roles.includes(user.value.role)) {
    throw createError({ statusCode: 403, statusMessage: 'Forbidden', message: `This page serves the roles ${roles.join(', ')}.`, fatal: true })
  }
})
