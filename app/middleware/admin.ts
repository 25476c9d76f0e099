/** Pages for site administrators. The API checks again; this only keeps others off the page. */
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  if (!loggedIn.value) return navigateTo({ path: '/sign-in', query: { next: to.fullPath } })
  if (user.value?.siteRole !== 'admin') throw createError({ statusCode: 404, statusMessage: 'Not found' })
})
