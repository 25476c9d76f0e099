import { projectParamsSchema } from '#shared/types/projects'
import type { ProjectDetail } from '#shared/types/api'

/** One project, for its members. */
export default defineEventHandler(async (event): Promise<ProjectDetail> => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  const { project, role } = await requireProjectRole(event, id, 'viewer')
  return {
    id: project.id, name: project.name, description: project.description, role,
    createdAt: project.createdAt.toISOString(), updatedAt: project.updatedAt.toISOString(),
  }
})
