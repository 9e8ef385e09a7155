import type pg from 'pg'
import type { Db } from '../db/client'
import type { JobQueue } from '../jobs/queue'
import type { Logger } from '../logger'
import type { Mailer } from '../mail/transport'

/** What the routers below /api/projects/:projectId are built with (from createApp's deps). */
export interface ProjectDeps {
  db: Db
  pool: pg.Pool
  mail: Mailer
  /** The background queue; without it (single-process tests) large imports commit in the request. */
  jobs?: JobQueue
  logger?: Logger
  uploadLimitMb: number
  /** The cap on one image upload (IMAGE_UPLOAD_LIMIT_MB). */
  imageUploadLimitMb: number
}
