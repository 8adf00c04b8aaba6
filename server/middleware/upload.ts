import type { RequestHandler } from 'express'
import multer from 'multer'
import { AppError, ValidationError } from '../errors'

/**
 * One file from the multipart field `file`, held in memory up to `maxBytes` (the storage layer
 * writes it under a name of its own). Too large → 413; another field or no file → 400.
 */
export function singleUpload(maxBytes: number): RequestHandler {
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 10 },
  }).single('file')
  return (req, res, next) => {
    parse(req, res, (error: unknown) => {
      if (error instanceof multer.MulterError && error.code === 'LIMIT_FILE_SIZE') {
        const megabytes = Math.round(maxBytes / 1024 / 1024)
        return next(new AppError('payload_too_large', `The file is larger than ${megabytes} MB.`))
      }
      if (error instanceof multer.MulterError) {
        return next(new ValidationError('Send one file in the multipart field "file".'))
      }
      if (error) return next(error)
      if (!req.file)
        return next(new ValidationError('Send one file in the multipart field "file".'))
      next()
    })
  }
}
