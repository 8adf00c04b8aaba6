import { randomUUID } from 'node:crypto'
import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Request, RequestHandler } from 'express'
import multer from 'multer'
import { AppError, ValidationError } from '../errors'

const ONE_FILE = 'Send one file in the multipart field "file".'

/** Multer's refusals in our words; `fileName` names the file when the parser saw one. */
function uploadHandler(
  parse: RequestHandler,
  maxBytes: number,
  nameOf: (req: Request) => string | undefined,
): RequestHandler {
  return (req, res, next) => {
    parse(req, res, (error: unknown) => {
      if (error instanceof multer.MulterError && error.code === 'LIMIT_FILE_SIZE') {
        const megabytes = Math.round(maxBytes / 1024 / 1024)
        const fileName = nameOf(req)
        const which = fileName ? `“${fileName}” is` : 'The file is'
        return next(
          new AppError('payload_too_large', `${which} larger than ${megabytes} MB.`, { fileName }),
        )
      }
      if (error instanceof multer.MulterError) return next(new ValidationError(ONE_FILE))
      if (error) return next(error)
      if (!req.file) return next(new ValidationError(ONE_FILE))
      next()
    })
  }
}

/**
 * One file from the multipart field `file`, held in memory up to `maxBytes` (the storage layer
 * writes it under a name of its own). Too large → 413; another field or no file → 400.
 */
export function singleUpload(maxBytes: number): RequestHandler {
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 10 },
  }).single('file')
  return uploadHandler(parse, maxBytes, () => undefined)
}

const namesSeen = new WeakMap<Request, string>()

/**
 * One file from the field `file`, written to a temporary file in `incomingDir` under a server-made
 * name (multer removes it when the upload fails; the route removes it when done). Large images
 * never sit whole in memory this way.
 */
export function singleUploadToDisk(maxBytes: number, incomingDir: string): RequestHandler {
  mkdirSync(incomingDir, { recursive: true })
  const storage = multer.diskStorage({
    destination: incomingDir,
    filename: (req, file, done) => {
      namesSeen.set(req, file.originalname)
      done(null, `${randomUUID()}.upload`)
    },
  })
  const parse = multer({ storage, limits: { fileSize: maxBytes, files: 1, fields: 10 } }).single(
    'file',
  )
  return uploadHandler(parse, maxBytes, (req) => namesSeen.get(req))
}

/** The folder for uploads in progress, inside the uploads folder (emptied at start). */
export const incomingDirOf = (uploadsDir: string) => join(uploadsDir, 'incoming')
