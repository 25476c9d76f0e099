import { defineStore } from 'pinia'
import type { ProjectListItem } from '#shared/types/api'
import type { ProjectCreatePayload } from '#shared/types/projects'

/** The signed-in user's projects: loading the list and creating a project. */
export const useProjectsStore = defineStore('projects', () => {
  // useRequestFetch forwards the session cookie during server-side rendering.
  const request = useRequestFetch()
  const items = ref<ProjectListItem[]>([])
  const loaded = ref(false)

  /** Fetch the list from the server. */
  async function load() {
    items.value = await request<ProjectListItem[]>('/api/projects')
    loaded.value = true
    return items.value
  }

  /** Create a project and reload the list; returns the new project's id. */
  async function create(payload: ProjectCreatePayload) {
    const created = await $fetch<{ id: number, name: string }>('/api/projects', { method: 'POST', body: payload })
    await load()
    return created.id
  }

  return { items, loaded, load, create }
})
