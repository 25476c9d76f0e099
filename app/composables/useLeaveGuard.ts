/**
 * Asks before the user leaves while `active()` holds (unsaved points, an unsaved drawing): the
 * browser's own prompt on closing or reloading the tab, a confirm() on leaving through the app.
 */
export function useLeaveGuard(active: () => boolean, message: string) {
  const onBeforeUnload = (e: BeforeUnloadEvent) => {
    if (!active()) return
    e.preventDefault()
    e.returnValue = message // older browsers show nothing without it
  }
  onMounted(() => window.addEventListener('beforeunload', onBeforeUnload))
  onBeforeUnmount(() => window.removeEventListener('beforeunload', onBeforeUnload))
  onBeforeRouteLeave(() => (active() ? window.confirm(message) : true))
}
