import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

/** Text files worth compressing; images and fonts in compressed formats are left alone. */
const COMPRESSIBLE = new Set(['.js', '.css', '.html', '.json', '.svg', '.ttf', '.otf', '.map', '.txt', '.ico']);
/** Below this, the headers cost more than compression saves. */
const MIN_BYTES = 1024;

export interface CompressionSummary {
  files: number;
  rawBytes: number;
  gzipBytes: number;
  brotliBytes: number;
}

function filesUnder(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    return entry.isDirectory() ? filesUnder(full) : [full];
  });
}

/**
 * Writes `<file>.br` (brotli, quality 11) and `<file>.gz` (gzip, level 9) beside every compressible
 * file of the exported web app, once at build time, so the server sends compressed bytes without
 * spending CPU per request. A compressed copy that is not smaller than the original is not written.
 */
export function precompressWebApp(webDir: string): CompressionSummary {
  const summary: CompressionSummary = { files: 0, rawBytes: 0, gzipBytes: 0, brotliBytes: 0 };
  for (const file of filesUnder(webDir)) {
    if (!COMPRESSIBLE.has(path.extname(file).toLowerCase())) continue;
    const raw = fs.readFileSync(file);
    if (raw.length < MIN_BYTES) continue;
    const brotli = zlib.brotliCompressSync(raw, {
      params: {
        [zlib.constants.BROTLI_PARAM_QUALITY]: zlib.constants.BROTLI_MAX_QUALITY,
        [zlib.constants.BROTLI_PARAM_SIZE_HINT]: raw.length,
      },
    });
    const gzip = zlib.gzipSync(raw, { level: zlib.constants.Z_BEST_COMPRESSION });
    if (brotli.length < raw.length) fs.writeFileSync(`${file}.br`, brotli);
    if (gzip.length < raw.length) fs.writeFileSync(`${file}.gz`, gzip);
    summary.files += 1;
    summary.rawBytes += raw.length;
    summary.gzipBytes += Math.min(gzip.length, raw.length);
    summary.brotliBytes += Math.min(brotli.length, raw.length);
  }
  return summary;
}
