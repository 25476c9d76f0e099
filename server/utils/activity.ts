/** Writing the project activity log. */

/** One activity entry: "actor verb object" with optional JSON data. */
export interface ActivityEntry {
  projectId: number
  actorId: number | null
  verb: string
  objectType: string
  objectId?: number | null
  data?: Record<string, unknown>
}

/** Append an entry to a project's activity log. */
export async function logActivity(entry: ActivityEntry): Promise<void> {
  await useDb().insert(tables.activity).values({ ...entry, objectId: entry.objectId ?? null, data: JSON.stringify(entry.data ?? {}) })
}
