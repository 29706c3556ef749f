/**
 * What a file is, from its first bytes (magic numbers) — never from the name or the Content-Type
 * the client sent. Signatures: PDF "%PDF-" (ISO 32000-1 §7.5.2), PNG 89 50 4E 47 0D 0A 1A 0A
 * (PNG spec §5.2), JPEG FF D8 FF (JFIF), ZIP "PK\x03\x04" / "PK\x05\x06" (APPNOTE 4.3.7),
 * GIF "GIF8", gzip 1F 8B (RFC 1952), UTF-16/UTF-8 byte-order marks (Unicode §23.8).
 */

export type BinaryKind = 'pdf' | 'png' | 'jpeg' | 'zip' | 'gif' | 'gzip';

const startsWith = (bytes: Uint8Array, signature: readonly number[]) =>
  bytes.length >= signature.length && signature.every((b, i) => bytes[i] === b);

export function binaryKindOf(bytes: Uint8Array): BinaryKind | null {
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d])) return 'pdf';
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'png';
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return 'jpeg';
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04]) || startsWith(bytes, [0x50, 0x4b, 0x05, 0x06])) return 'zip';
  if (startsWith(bytes, [0x47, 0x49, 0x46, 0x38])) return 'gif';
  if (startsWith(bytes, [0x1f, 0x8b])) return 'gzip';
  return null;
}

export const binaryKindWords: Readonly<Record<BinaryKind, string>> = {
  pdf: 'a PDF document',
  png: 'a PNG image',
  jpeg: 'a JPEG image',
  zip: 'a ZIP archive (or an Office file such as .xlsx)',
  gif: 'a GIF image',
  gzip: 'a gzip-compressed file',
};

export type TextDecodeResult =
  | { ok: true; text: string; encoding: 'utf-8' | 'utf-16le' | 'utf-16be' }
  | { ok: false; reason: string };

/** Line (1-based) of a byte offset, counting LF bytes before it. */
function lineOfByte(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < bytes.length; i += 1) if (bytes[i] === 0x0a) line += 1;
  return line;
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629 §4), or -1. */
export function firstInvalidUtf8Byte(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i] as number;
    let need = 0;
    let min = 0;
    if (b < 0x80) {
      i += 1;
      continue;
    } else if (b >= 0xc2 && b <= 0xdf) {
      need = 1;
      min = 0x80;
    } else if (b >= 0xe0 && b <= 0xef) {
      need = 2;
      min = 0x800;
    } else if (b >= 0xf0 && b <= 0xf4) {
      need = 3;
      min = 0x10000;
    } else return i;
    let code = b & (0x3f >> need);
    for (let k = 1; k <= need; k += 1) {
      const c = bytes[i + k];
      if (c === undefined || (c & 0xc0) !== 0x80) return i;
      code = (code << 6) | (c & 0x3f);
    }
    if (code < min || code > 0x10ffff || (code >= 0xd800 && code <= 0xdfff)) return i;
    i += need + 1;
  }
  return -1;
}

/**
 * Text files: UTF-8 (with or without BOM) or UTF-16 with its BOM. UTF-16 without a BOM (many NUL
 * bytes) and anything that is not valid UTF-8 are refused with the place of the first bad byte.
 */
export function decodeText(bytes: Uint8Array): TextDecodeResult {
  if (startsWith(bytes, [0xff, 0xfe])) return { ok: true, text: new TextDecoder('utf-16le').decode(bytes.subarray(2)), encoding: 'utf-16le' };
  if (startsWith(bytes, [0xfe, 0xff])) return { ok: true, text: new TextDecoder('utf-16be').decode(bytes.subarray(2)), encoding: 'utf-16be' };
  const body = startsWith(bytes, [0xef, 0xbb, 0xbf]) ? bytes.subarray(3) : bytes;
  const nul = body.indexOf(0);
  if (nul !== -1) {
    const sample = body.subarray(0, Math.min(body.length, 512));
    const nuls = sample.filter((b) => b === 0).length;
    if (nuls * 4 >= sample.length) {
      return {
        ok: false,
        reason: 'The file looks like UTF-16 text without a byte-order mark. Save it as "CSV UTF-8" (or UTF-16 with a BOM) and try again.',
      };
    }
    return { ok: false, reason: `The file contains a NUL byte at byte ${nul + 1} (line ${lineOfByte(body, nul)}): it is not a text file.` };
  }
  const bad = firstInvalidUtf8Byte(body);
  if (bad !== -1) {
    return {
      ok: false,
      reason: `The file is not valid UTF-8: byte ${bad + 1} (line ${lineOfByte(body, bad)}) cannot start or continue a character. Save it as "CSV UTF-8" and try again.`,
    };
  }
  return { ok: true, text: new TextDecoder('utf-8').decode(body), encoding: 'utf-8' };
}
