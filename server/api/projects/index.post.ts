import { projectCreateSchema } from '#shared/types/projects'

/** Create a project; its creator becomes the owner. */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readValidatedBody(event, projectCreateSchema.parse)
  const project = await useDb().transaction(async (tx) => {
    const [p] = await tx.insert(tables.projects).values({ ...body, createdBy: user.id }).returning()
    await tx.insert(tables.memberships).values({ projectId: p!.id, userId: user.id, role: 'owner' })
    await tx.insert(tables.activity).values({ projectId: p!.id, actorId: user.id, verb: 'created', objectType: 'project', objectId: p!.id })
    return p!
  })
  setResponseStatus(event, 201)
  return { id: project.id, name: project.name }
})
