import fs from 'node:fs';
import type { Server } from 'node:http';
import path from 'node:path';
import express from 'express';
import { isLoopbackHostHeader } from '@/server/http/host-allow-list';
import fakeWorks from './fake-works.json';

/**
 * The development and test stand-in for the bibliographic metadata service: an express app on
 * 127.0.0.1 (a free port) answering GET /works/{doi} in the registration agencies' JSON shape for
 * the DOIs in fake-works.json and data/demo-library.json, 404 for any other DOI. `setDelay(ms)`
 * makes it slow (for the timeout test). It answers only requests addressed to a loopback host name
 * (403 otherwise, so a DNS-rebinding page cannot use it). Never started in production.
 */

export interface FakeWork {
  doi: string;
  title: string | null;
  authors: { given?: string; family: string }[];
  journal: string;
  year: number | null;
  volume?: string | null;
  page?: string | null;
}

export interface FakeMetadataService {
  url: string;
  setDelay(ms: number): void;
  add(work: FakeWork): void;
  close(): Promise<void>;
}

/** Citations of the demo library (when that file exists): authors as "Given Family, …". */
function demoLibraryWorks(root: string): FakeWork[] {
  const file = path.join(root, 'data', 'demo-library.json');
  if (!fs.existsSync(file)) return [];
  const works: FakeWork[] = [];
  const visit = (value: unknown) => {
    if (Array.isArray(value)) return value.forEach(visit);
    if (!value || typeof value !== 'object') return;
    const record = value as Record<string, unknown>;
    if (typeof record.doi === 'string' && typeof record.authors === 'string' && typeof record.journal === 'string') {
      works.push({
        doi: record.doi,
        title: typeof record.title === 'string' ? record.title : null,
        authors: record.authors
          .split(/\s*(?:,|&|\band\b)\s*/)
          .filter(Boolean)
          .map((name) => {
            const words = name.trim().split(/\s+/);
            return { given: words.slice(0, -1).join(' ') || undefined, family: words[words.length - 1] ?? name };
          }),
        journal: record.journal,
        year: typeof record.year === 'number' ? record.year : null,
        volume: typeof record.volume === 'string' ? record.volume : null,
        page: typeof record.pages === 'string' ? record.pages : null,
      });
    }
    Object.values(record).forEach(visit);
  };
  try {
    visit(JSON.parse(fs.readFileSync(file, 'utf8')));
  } catch {
    return [];
  }
  return works;
}

export async function startFakeMetadataService(options: { root?: string; keepProcessAlive?: boolean } = {}): Promise<FakeMetadataService> {
  const works = new Map<string, FakeWork>();
  const add = (work: FakeWork) => works.set(work.doi.toLowerCase(), work);
  (fakeWorks.works as FakeWork[]).forEach(add);
  demoLibraryWorks(options.root ?? process.cwd()).forEach((work) => {
    if (!works.has(work.doi.toLowerCase())) add(work);
  });
  let delayMs = 0;

  const app = express();
  app.disable('x-powered-by');
  app.use((req, res, next) => {
    if (isLoopbackHostHeader(req.get('host'))) return next();
    res.status(403).type('text/plain').send('This development service answers only on a loopback host name.');
  });
  // DOIs contain slashes: everything after /works/ is the DOI.
  app.get(/^\/works\/(.+)$/, async (req, res) => {
    if (delayMs > 0) await new Promise((resolve) => setTimeout(resolve, delayMs));
    const doi = decodeURIComponent((req.params as Record<string, string>)[0] ?? '').toLowerCase();
    const work = works.get(doi);
    if (!work) {
      res.status(404).type('text/plain').send('Resource not found.');
      return;
    }
    res.json({
      status: 'ok',
      'message-type': 'work',
      message: {
        DOI: work.doi,
        title: work.title ? [work.title] : [],
        author: work.authors.map((a) => ({ given: a.given, family: a.family, sequence: 'additional' })),
        'container-title': [work.journal],
        issued: { 'date-parts': [[work.year]] },
        volume: work.volume ?? undefined,
        page: work.page ?? undefined,
        type: 'journal-article',
      },
    });
  });
  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(0, '127.0.0.1', () => resolve(listening));
    listening.once('error', reject);
  });
  if (!options.keepProcessAlive) server.unref();
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return {
    url: `http://127.0.0.1:${port}`,
    setDelay: (ms) => {
      delayMs = ms;
    },
    add,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
