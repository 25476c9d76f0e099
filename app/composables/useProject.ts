import type { ProjectDetail } from '#shared/types/api'
import { roleAtLeast } from '#shared/types/roles'

/** Shows the 404 page when one of a page's own fetches answered 404 (hidden objects look missing). */
export function throwIfNotFound(...errors: ({ statusCode?: number } | null | undefined)[]): void {
  if (errors.some(e => e?.statusCode === 404)) throw createError({ statusCode: 404, statusMessage: 'Not found', fatal: true })
}

/**
 * The project of a `/projects/[id]/…` page, loaded once for all of them: fetched under the key
 * `project-<id>` (shared with the other pages of the project), the 404 page when it does not exist
 * or the user is not a member, and what the user's role allows.
 */
export async function useProject() {
  const route = useRoute()
  const id = computed(() => Number(route.params.id))
  const { data: project, error, refresh } = await useFetch<ProjectDetail>(() => `/api/projects/${id.value}`, { key: `project-${id.value}` })
  throwIfNotFound(error.value)
  const canEdit = computed(() => !!project.value && roleAtLeast(project.value.role, 'editor'))
  const isOwner = computed(() => !!project.value && roleAtLeast(project.value.role, 'owner'))
  return { id, project, error, refresh, canEdit, isOwner }
}
