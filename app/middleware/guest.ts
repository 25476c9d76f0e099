/** Pages for signed-out visitors (sign-in, sign-up): signed-in users go to their projects. */
export default defineNuxtRouteMiddleware(() => {
  const { loggedIn } = useUserSession()
  if (loggedIn.value) return navigateTo('/projects')
})
