import type pg from 'pg'
import type { Db } from '../db/client'
import { ApiError } from '../http/errors'
import type { Logger } from '../logger'
import type { Mailer } from '../mail/transport'
import { commitImport } from '../services/import-commit'
import { tileImage } from '../services/image-tiling'
import { runPackBuild } from '../services/pack-build'
import type { JobHandler } from './queue'

/**
 * Commits a queued import. A refusal (row errors, overlaps) is final: the import reads `failed`
 * with the reason and the job ends. Anything else (database gone) is thrown for pg-boss to retry.
 */
export function importCommitJob(db: Db, pool: pg.Pool, mail: Mailer, logger: Logger): JobHandler {
  return async (data) => {
    const importId = String(data.importId)
    try {
      await commitImport(db, mail, pool, importId, {
        fromJob: true,
        actorId: Number(data.actorId),
        confirmDuplicate: data.confirmDuplicate === true,
        attempt: typeof data.attempt === 'string' ? data.attempt : undefined,
      })
    } catch (err: unknown) {
      if (err instanceof ApiError) {
        logger.warn({ importId, code: err.code }, 'import refused')
        return
      }
      throw err
    }
  }
}

/**
 * Builds a queued design pack. The build starts from scratch each time, so a retry after a crash
 * (pg-boss) is safe; a failure is recorded on the pack and, unless final, rethrown for a retry.
 */
export function packBuildJob(db: Db, logger: Logger): JobHandler {
  return async (data) => {
    const packId = String(data.packId)
    try {
      await runPackBuild(db, packId, typeof data.attempt === 'string' ? data.attempt : undefined)
    } catch (err: unknown) {
      logger.warn({ packId, err }, 'pack build failed')
      throw err
    }
  }
}

/**
 * Tiles a stored image. A refusal (a damaged body) is final — the image reads failed with the
 * reason — and so is finding it taken or gone; anything else is thrown for pg-boss to retry.
 */
export function imageTilingJob(db: Db, logger: Logger): JobHandler {
  return async (data) => {
    const imageId = Number(data.imageId)
    const outcome = await tileImage(db, imageId, String(data.attempt))
    if (outcome !== 'ready') logger.warn({ imageId, outcome }, 'image not tiled')
  }
}
