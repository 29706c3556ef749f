/**
 * Just enough MIME (RFC 2045–2047) to read back what our own mailer sends to the development
 * sink: unfolded headers, encoded-word subjects, multipart bodies, base64 and quoted-printable.
 * Not a general mail parser.
 */
export interface ParsedMail {
  subject: string;
  from: string;
  to: string;
  text: string;
  html: string;
}

interface Part {
  headers: Map<string, string>;
  body: string;
}

function splitPart(raw: string): Part {
  const normalised = raw.replace(/\r\n/g, '\n');
  const end = normalised.indexOf('\n\n');
  const headerText = end === -1 ? normalised : normalised.slice(0, end);
  const body = end === -1 ? '' : normalised.slice(end + 2);
  const headers = new Map<string, string>();
  // Folded header lines start with white space (RFC 5322 §2.2.3).
  for (const line of headerText.replace(/\n[ \t]+/g, ' ').split('\n')) {
    const colon = line.indexOf(':');
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  return { headers, body };
}

function headerParam(value: string | undefined, name: string): string | null {
  if (!value) return null;
  const match = new RegExp(`${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]*))`, 'i').exec(value);
  return match ? (match[1] ?? match[2] ?? null) : null;
}

function decodeQuotedPrintable(text: string): Buffer {
  const joined = text.replace(/=\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i += 1) {
    const char = joined[i] as string;
    const hex = joined.slice(i + 1, i + 3);
    if (char === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(char, 'utf8'));
    }
  }
  return Buffer.from(bytes);
}

function decodeBody(part: Part): string {
  const encoding = (part.headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  if (encoding === 'base64') return Buffer.from(part.body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (encoding === 'quoted-printable') return decodeQuotedPrintable(part.body).toString('utf8');
  return part.body;
}

/** RFC 2047 encoded words: =?utf-8?B?…?= and =?utf-8?Q?…?= */
export function decodeEncodedWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_all, _charset: string, kind: string, data: string) =>
      kind.toUpperCase() === 'B'
        ? Buffer.from(data, 'base64').toString('utf8')
        : decodeQuotedPrintable(data.replace(/_/g, ' ')).toString('utf8'),
    );
}

function collect(part: Part, into: { text: string; html: string }) {
  const contentType = (part.headers.get('content-type') ?? 'text/plain').toLowerCase();
  if (contentType.startsWith('multipart/')) {
    const boundary = headerParam(part.headers.get('content-type'), 'boundary');
    if (!boundary) return;
    const pieces = part.body.split(`--${boundary}`).slice(1);
    for (const piece of pieces) {
      if (piece.startsWith('--')) break;
      collect(splitPart(piece.replace(/^\n/, '')), into);
    }
    return;
  }
  const decoded = decodeBody(part).replace(/\n$/, '');
  if (contentType.startsWith('text/html')) into.html ||= decoded;
  else if (contentType.startsWith('text/plain')) into.text ||= decoded;
}

export function parseMail(raw: string): ParsedMail {
  const root = splitPart(raw);
  const bodies = { text: '', html: '' };
  collect(root, bodies);
  return {
    subject: decodeEncodedWords(root.headers.get('subject') ?? ''),
    from: decodeEncodedWords(root.headers.get('from') ?? ''),
    to: decodeEncodedWords(root.headers.get('to') ?? ''),
    ...bodies,
  };
}

/** The http(s) links in a text body, in order, without trailing punctuation. */
export function extractLinks(text: string): string[] {
  return [...text.matchAll(/https?:\/\/[^\s<>"')]+/g)].map((m) => m[0].replace(/[.,;:]+$/, ''));
}
