import express, { type Request, type Response } from 'express';
import { AppError } from '@/server/http/errors';

/**
 * The request body as bytes, whatever its Content-Type (an upload is the raw file, not a form).
 * Over `limitBytes` → 413 with the limit in words; a JSON body (already parsed by the API's JSON
 * parser) → 415, since files are sent as they are.
 */
export function readRawBody(req: Request, res: Response, limitBytes: number, what: string): Promise<Buffer> {
  if (req.is('application/json')) {
    return Promise.reject(new AppError('UNSUPPORTED_MEDIA', `Send the ${what} itself as the request body (e.g. Content-Type text/csv or application/octet-stream), not JSON.`));
  }
  const parser = express.raw({ type: () => true, limit: limitBytes });
  return new Promise((resolve, reject) => {
    parser(req, res, (error?: unknown) => {
      if (error) {
        const type = (error as { type?: string }).type;
        if (type === 'entity.too.large') {
          reject(new AppError('PAYLOAD_TOO_LARGE', `The ${what} is larger than ${Math.round(limitBytes / (1024 * 1024))} MB, the most this endpoint accepts.`));
          return;
        }
        reject(error);
        return;
      }
      resolve(Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0));
    });
  });
}
