import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';

import { UPLOAD_MAX_BYTES } from '../../shared/contracts/uploads.ts';
import { HttpError } from '../http/http-error.ts';

/** Extensions accepted per upload route, lower-case with the dot. */
export type AcceptedExtension = '.csv' | '.json' | '.bvh';

function extensionOf(name: string): string {
  const dot = name.lastIndexOf('.');
  return dot >= 0 ? name.slice(dot).toLowerCase() : '';
}

/**
 * Multipart middleware for one file in the field `file` (held in memory, at most
 * UPLOAD_MAX_BYTES), accepting only the given extensions. Failures become 400/413 errors that say
 * what was wrong; the text form fields are left in `req.body`.
 */
export function receiveFile(accept: readonly AcceptedExtension[]) {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 10, fieldSize: 4096 },
    fileFilter: (_req, file, cb) => {
      const ext = extensionOf(file.originalname);
      if (!(accept as readonly string[]).includes(ext)) {
        cb(new HttpError(415, 'unsupported_type', `"${file.originalname}" is not a ${accept.join(' or ')} file. Upload a ${accept.join(' or ')} file.`, 'file'));
        return;
      }
      cb(null, true);
    },
  }).single('file');

  return (req: Request, res: Response, next: NextFunction) => {
    upload(req, res, (err: unknown) => {
      if (!err) {
        if (!req.file) return next(new HttpError(400, 'file_missing', 'Choose a file to upload (multipart field "file").', 'file'));
        if (req.file.size === 0) return next(new HttpError(400, 'file_empty', `"${req.file.originalname}" is empty.`, 'file'));
        // Text only: a NUL byte means a binary file (a spreadsheet, an image) renamed to .csv/.json.
        if (req.file.buffer.includes(0)) return next(new HttpError(415, 'unsupported_type', `"${req.file.originalname}" is not a text file. Save it as plain ${accept.join(' or ')} (UTF-8).`, 'file'));
        return next();
      }
      if (err instanceof HttpError) return next(err);
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new HttpError(413, 'file_too_large', `The file is larger than ${UPLOAD_MAX_BYTES / 1024 / 1024} MiB, the upload limit.`, 'file'));
        }
        return next(new HttpError(400, 'bad_upload', `Upload refused: ${err.message} (${err.field ?? 'file'}). Send one file in the field "file".`, err.field ?? 'file'));
      }
      // Anything else the multipart parser throws is about the request itself: a missing boundary,
      // a body cut off before its closing boundary, malformed part headers.
      const why = err instanceof Error ? err.message : typeof err === 'string' ? err : 'unreadable form data';
      next(new HttpError(400, 'malformed_upload', `The upload is not a complete multipart form (${why}). Send the file again as multipart/form-data with the field "file".`, 'file'));
    });
  };
}

/** A file name safe for an object key: no path parts, only a plain set of characters. */
export function safeFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? 'upload';
  const cleaned = base.replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^\.+/, '');
  return cleaned.slice(-120) || 'upload';
}
