/** Pages for signed-in users: send others to the sign-in page and back afterwards. */
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn } = useUserSession()
  if (!loggedIn.value) return navigateTo({ path: '/sign-in', query: { next: to.fullPath } })
})
