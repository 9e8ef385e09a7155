import type { RequestHandler } from 'express'
import multer from 'multer'
import { ApiError, badRequest } from './errors'

/**
 * One multipart file in field `file`, held in memory up to `limitMb`. Too large → 413, no file →
 * 400 naming the field. Other multipart fields stay on req.body as strings.
 */
export function singleUpload(limitMb: number): RequestHandler {
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: Math.floor(limitMb * 1024 * 1024), files: 1, fields: 10 },
    defParamCharset: 'utf8',
  }).single('file')
  return (req, res, next) => {
    parse(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return next(
            new ApiError(413, 'too_large', `The file is larger than ${limitMb} MB.`, [
              { path: 'file', message: `over ${limitMb} MB` },
            ]),
          )
        return next(
          badRequest(`Upload refused: ${err.message}.`, [
            { path: err.field ?? 'file', message: err.message },
          ]),
        )
      }
      if (err) return next(err)
      if (!req.file)
        return next(
          badRequest('Attach the file in the multipart field "file".', [
            { path: 'file', message: 'required' },
          ]),
        )
      next()
    })
  }
}

/**
 * Bidirectional controls (U+061C, U+200E/F, U+202A–U+202E, U+2066–U+2069) can make
 * "report\u202Efdp.exe" read as "reportexe.pdf"; they are removed from names (Unicode TR #9).
 */
const bidiControls = /[\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/gu

/** Keeps the last path part and drops control characters: the name is shown and sent back. */
export function cleanFileName(name: string, fallback = 'upload'): string {
  const last = name.slice(Math.max(name.lastIndexOf('/'), name.lastIndexOf('\\')) + 1)
  const base = last.replace(bidiControls, '')
  let clean = ''
  for (const ch of base) {
    const code = ch.codePointAt(0) ?? 0
    clean += code < 0x20 || code === 0x7f || ch === '"' ? '_' : ch
  }
  clean = clean.trim().slice(0, 200)
  return clean === '' ? fallback : clean
}
