import { createHash, createHmac, timingSafeEqual } from 'node:crypto';
import type { IncomingHttpHeaders } from 'node:http';

/**
 * Checks an AWS Signature Version 4 `Authorization` header against one key pair, as S3 does
 * (AWS documentation, "Authenticating requests: using the Authorization header (AWS Signature
 * Version 4)"): rebuild the canonical request from the method, path, query and signed headers,
 * derive the signing key from the secret and the credential scope, and compare signatures in
 * constant time. The fake S3 runs this before the request reaches s3rver, which itself lets
 * unsigned requests through and does not check version-4 signatures at all.
 *
 * Known limit: the payload is trusted to match its signed `x-amz-content-sha256` header (the body
 * streams on to the store unhashed); for a local development fake that is enough.
 */

export interface SignedRequest {
  method: string;
  /** The request target as received: path and query, still percent-encoded. */
  url: string;
  headers: IncomingHttpHeaders;
}

export type SignatureCheck = { ok: true } | { ok: false; code: 'AccessDenied' | 'InvalidAccessKeyId' | 'SignatureDoesNotMatch' | 'RequestTimeTooSkewed'; reason: string };

/** S3 refuses requests whose time is more than 15 minutes from its own (AWS S3 error RequestTimeTooSkewed). */
const MAX_SKEW_MS = 15 * 60 * 1000;

const AUTHORIZATION = /^AWS4-HMAC-SHA256 Credential=([^/,\s]+)\/(\d{8})\/([^/,\s]+)\/([^/,\s]+)\/aws4_request,\s*SignedHeaders=([a-z0-9;-]+),\s*Signature=([0-9a-f]{64})$/;

/** RFC 3986 unreserved characters stay, everything else is %XX (what SigV4 asks for). */
const encodeRfc3986 = (text: string) => encodeURIComponent(text).replace(/[!'()*]/g, (ch) => `%${ch.charCodeAt(0).toString(16).toUpperCase()}`);

const safeDecode = (text: string) => {
  try {
    return decodeURIComponent(text);
  } catch {
    return text;
  }
};

function canonicalQuery(query: string): string {
  if (!query) return '';
  return query
    .split('&')
    .filter(Boolean)
    .map((pair) => {
      const at = pair.indexOf('=');
      const name = at < 0 ? pair : pair.slice(0, at);
      const value = at < 0 ? '' : pair.slice(at + 1);
      return [encodeRfc3986(safeDecode(name)), encodeRfc3986(safeDecode(value))] as const;
    })
    .sort(([a, av], [b, bv]) => (a < b ? -1 : a > b ? 1 : av < bv ? -1 : av > bv ? 1 : 0))
    .map(([name, value]) => `${name}=${value}`)
    .join('&');
}

const headerValue = (headers: IncomingHttpHeaders, name: string): string | undefined => {
  const value = headers[name];
  return Array.isArray(value) ? value.join(',') : value;
};

/** "20261204T051700Z" → epoch ms, or NaN. */
function parseAmzDate(text: string): number {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(text);
  if (!m) return Number.NaN;
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), Number(m[4]), Number(m[5]), Number(m[6]));
}

const hmac = (key: Buffer | string, data: string) => createHmac('sha256', key).update(data, 'utf8').digest();

export function checkS3Signature(
  request: SignedRequest,
  credentials: { accessKeyId: string; secretAccessKey: string },
  now: number = Date.now(),
): SignatureCheck {
  const authorization = headerValue(request.headers, 'authorization');
  if (!authorization) return { ok: false, code: 'AccessDenied', reason: 'The request is not signed; this store needs its access key and secret.' };
  const match = AUTHORIZATION.exec(authorization.trim());
  if (!match) return { ok: false, code: 'AccessDenied', reason: 'Only AWS Signature Version 4 in the Authorization header is accepted.' };
  const [, accessKeyId = '', day = '', region = '', service = '', signedHeaderList = '', signature = ''] = match;
  if (accessKeyId !== credentials.accessKeyId) return { ok: false, code: 'InvalidAccessKeyId', reason: 'The access key is not the one this store was started with.' };

  const signedHeaders = signedHeaderList.split(';');
  if (!signedHeaders.includes('host') || !signedHeaders.includes('x-amz-date')) {
    return { ok: false, code: 'AccessDenied', reason: 'The signature must cover the host and x-amz-date headers.' };
  }
  const amzDate = headerValue(request.headers, 'x-amz-date') ?? '';
  const time = parseAmzDate(amzDate);
  if (!Number.isFinite(time) || amzDate.slice(0, 8) !== day) return { ok: false, code: 'AccessDenied', reason: 'x-amz-date is missing or does not match the credential scope.' };
  if (Math.abs(now - time) > MAX_SKEW_MS) return { ok: false, code: 'RequestTimeTooSkewed', reason: 'The request time is more than 15 minutes from the server time.' };

  const at = request.url.indexOf('?');
  const rawPath = at < 0 ? request.url : request.url.slice(0, at);
  const query = at < 0 ? '' : request.url.slice(at + 1);
  const canonicalHeaders = signedHeaders
    .map((name) => `${name}:${(headerValue(request.headers, name) ?? '').trim().replace(/\s+/g, ' ')}\n`)
    .join('');
  const payloadHash = headerValue(request.headers, 'x-amz-content-sha256') ?? createHash('sha256').update('').digest('hex');
  const canonicalRequest = [request.method.toUpperCase(), rawPath || '/', canonicalQuery(query), canonicalHeaders, signedHeaderList, payloadHash].join('\n');
  const scope = `${day}/${region}/${service}/aws4_request`;
  const stringToSign = ['AWS4-HMAC-SHA256', amzDate, scope, createHash('sha256').update(canonicalRequest, 'utf8').digest('hex')].join('\n');
  const signingKey = hmac(hmac(hmac(hmac(`AWS4${credentials.secretAccessKey}`, day), region), service), 'aws4_request');
  const expected = createHmac('sha256', signingKey).update(stringToSign, 'utf8').digest();
  const given = Buffer.from(signature, 'hex');
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) {
    return { ok: false, code: 'SignatureDoesNotMatch', reason: 'The signature does not match: wrong secret, or the request was changed after signing.' };
  }
  return { ok: true };
}
