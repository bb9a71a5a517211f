import { rm } from 'node:fs/promises';
import type { Request, Response } from 'express';
import multer, { MulterError, type StorageEngine } from 'multer';
import { ApiProblem } from '@server/http/api-problem';
import { ByteLimitExceededError, writeHashedFile, type HashedFile } from '@server/storage/hashing-file-writer';

export interface ReceivedFile extends HashedFile {
  originalName: string;
}

export interface ReceivedMultipart {
  file: ReceivedFile | null;
  fields: Record<string, string>;
  /** Removes the temporary file; call whatever happens next (idempotent). */
  discard(): Promise<void>;
}

/** Streams the file part to a temp file while hashing it: the upload is never held in memory. */
function hashingStorage(tempDir: string, maxBytes: number): StorageEngine {
  return {
    _handleFile(_req, file, callback) {
      writeHashedFile(file.stream, tempDir, { maxBytes }).then(
        (written) => callback(null, { path: written.path, size: written.bytes, sha256: written.sha256 } as never),
        (error: unknown) => callback(error as Error),
      );
    },
    _removeFile(_req, file, callback) {
      rm(file.path, { force: true }).then(() => callback(null), callback);
    },
  };
}

function tooLarge(maxBytes: number): ApiProblem {
  return new ApiProblem('payload_too_large', `The file is larger than the plan's upload limit of ${maxBytes} bytes.`, {
    extensions: { limit: 'maxUploadBytes', allowed: maxBytes },
  });
}

function problemFromUploadError(error: unknown, maxBytes: number, fileField: string): ApiProblem {
  if (error instanceof ApiProblem) return error;
  if (error instanceof ByteLimitExceededError) return tooLarge(maxBytes);
  if (error instanceof MulterError) {
    if (error.code === 'LIMIT_FILE_SIZE') return tooLarge(maxBytes);
    if (error.code === 'LIMIT_UNEXPECTED_FILE') {
      return new ApiProblem('multipart_invalid', `Send exactly one file, in the part named "${fileField}".`);
    }
    return new ApiProblem('multipart_invalid', `The multipart body breaks a limit (${error.code}).`);
  }
  return new ApiProblem('multipart_invalid', 'The multipart body ended early or is malformed; send it again.', { cause: error });
}

/**
 * Receives a multipart/form-data request with at most one file part (`fileField`) and small text fields. Refused
 * or aborted uploads leave no file behind (the writer removes its partial file, multer removes finished ones).
 */
export async function receiveMultipart(
  req: Request,
  res: Response,
  options: { tempDir: string; maxBytes: number; fileField?: string; textFields?: string[] },
): Promise<ReceivedMultipart> {
  const fileField = options.fileField ?? 'file';
  if (!req.is('multipart/form-data')) {
    throw new ApiProblem('unsupported_media_type', `Send the upload as multipart/form-data with the WAV in a part named "${fileField}".`);
  }
  const upload = multer({
    storage: hashingStorage(options.tempDir, options.maxBytes),
    // One byte more than the limit so our own writer reports the limit by name.
    limits: { files: 1, fileSize: options.maxBytes + 1, fields: 10, fieldSize: 4 * 1024 * 1024, parts: 12 },
  }).single(fileField);
  try {
    await new Promise<void>((resolve, reject) => upload(req, res, (error?: unknown) => (error ? reject(error) : resolve())));
  } catch (error) {
    throw problemFromUploadError(error, options.maxBytes, fileField);
  }
  const stored = req.file as (Express.Multer.File & { sha256: string }) | undefined;
  const file: ReceivedFile | null = stored
    ? { path: stored.path, sha256: stored.sha256, bytes: stored.size, originalName: stored.originalname }
    : null;
  const fields: Record<string, string> = {};
  for (const [name, value] of Object.entries((req.body ?? {}) as Record<string, unknown>)) {
    if (typeof value === 'string') fields[name] = value;
  }
  return {
    file,
    fields,
    discard: async () => {
      if (file) await rm(file.path, { force: true });
    },
  };
}
