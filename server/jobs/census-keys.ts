/** Names shared by the census queue (server/utils/census-queue.ts) and its workers. */
import type { ClassifyOptions } from '../../shared/census/classify'
import type { CensusBounds } from '../../shared/census/enumerate'

export const CENSUS_QUEUE_NAME = 'wingfold-census'
export const censusCancelKey = (jobId: number) => `wingfold:census:cancel:${jobId}`

/** Data of one BullMQ census job. */
export interface CensusQueueData {
  jobId: number
  bounds: CensusBounds
  classify: ClassifyOptions
  skip: string[]
}
