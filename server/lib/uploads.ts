import type { Request, Response } from "express";
import multer from "multer";
import { HttpError } from "./errors.js";

export interface Upload {
  file: Express.Multer.File;
  fields: Record<string, unknown>;
}

// Read after the caller's access checks, so nobody unauthorised gets to stream a body into memory.
export function readUpload(req: Request, res: Response, maxBytes: number): Promise<Upload> {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 10, fieldSize: 10_000 },
    // Browsers send file names as UTF-8 without saying so; busboy's default would read them as latin1.
    defParamCharset: "utf8",
  }).single("file");
  return new Promise((resolve, reject) => {
    upload(req, res, (error: unknown) => {
      if (error instanceof multer.MulterError) {
        if (error.code === "LIMIT_FILE_SIZE") {
          reject(new HttpError(413, "too_large", `The file is larger than ${Math.floor(maxBytes / 1024)} KiB.`, { file: "too large" }));
        } else {
          reject(new HttpError(400, "invalid_upload", `The upload was refused: ${error.message}.`, { [error.field ?? "file"]: error.message }));
        }
        return;
      }
      // busboy's own errors (a malformed multipart body) are bad input too, never a server fault.
      if (error) return reject(new HttpError(400, "invalid_upload", "The multipart body could not be read."));
      if (!req.file) return reject(new HttpError(400, "invalid_upload", "Send the file as multipart/form-data in a field named \"file\".", { file: "required" }));
      resolve({ file: req.file, fields: (req.body ?? {}) as Record<string, unknown> });
    });
  });
}
