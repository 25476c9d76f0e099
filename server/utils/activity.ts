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

/** The insert of an entry, to run in one `db.batch` with the write it records. */
export function activityInsert(entry: ActivityEntry) {
  return useDb().insert(tables.activity).values({ ...entry, objectId: entry.objectId ?? null,
    data: JSON.stringify(entry.data ?? {}) })
}

/** Append an entry to a project's activity log. */
export async function logActivity(entry: ActivityEntry): Promise<void> {
  await activityInsert(entry)
}
