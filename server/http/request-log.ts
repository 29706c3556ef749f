import type { RequestHandler } from 'express';

/** One line per API request: method, path, status, duration. Static files are not logged. */
export function requestLog(write: (line: string) => void = (line) => console.log(line)): RequestHandler {
  return (req, res, next) => {
    const started = process.hrtime.bigint();
    res.on('finish', () => {
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      write(`${new Date().toISOString()} ${req.method} ${req.originalUrl} ${res.statusCode} ${ms.toFixed(1)}ms`);
    });
    next();
  };
}
