import type { Request, RequestHandler } from 'express';
import { AppError } from './errors';

const LOOPBACK = new Set(['localhost', '127.0.0.1', '::1', '[::1]']);

/** The host name of a Host header, lower-cased, without the port (IPv6 in brackets kept whole). */
export function hostNameOf(hostHeader: string | undefined): string {
  const host = (hostHeader ?? '').trim().toLowerCase();
  if (host.startsWith('[')) return host.slice(0, host.indexOf(']') + 1);
  return host.replace(/:\d+$/, '');
}

/** True for the loopback names (localhost, 127.0.0.1, ::1) of a Host header, whatever its port. */
export function isLoopbackHostHeader(hostHeader: string | undefined): boolean {
  return LOOPBACK.has(hostNameOf(hostHeader));
}

export function isLoopbackHost(req: Request): boolean {
  return isLoopbackHostHeader(req.get('host'));
}

/**
 * Answers only for the host names the app is reached at: APP_URL's, loopback, and ALLOWED_HOSTS.
 * A page on another name that resolves to this server (DNS rebinding) or a forged Host gets 403
 * before any route runs (OWASP: validate the Host header against an allow-list).
 */
export function hostAllowList(appUrl: string, extraHosts: string): RequestHandler {
  const allowed = new Set([...LOOPBACK, hostNameOf(new URL(appUrl).host)]);
  for (const host of extraHosts.split(',')) if (host.trim()) allowed.add(hostNameOf(host));
  return (req, _res, next) => {
    const name = hostNameOf(req.get('host'));
    if (allowed.has(name)) return next();
    next(new AppError('FORBIDDEN', `This server does not answer for the host "${name || '(none)'}".`));
  };
}
