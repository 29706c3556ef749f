import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { startFakeMetadataService, type FakeMetadataService } from '@/server/dev/fake-metadata-service';
import fakeWorks from '@/server/dev/fake-works.json';

/**
 * The repository stands on its own: no file names a folder of a developer's machine or a shared
 * folder outside the repository, and the fake DOI service's records say where they come from (the
 * article, the data files here that cite it, how the record was checked) without serving any of it.
 */

const root = path.resolve(__dirname, '../..');
const CHECKED = ['primary', 'review', 'secondary', 'recalled'];

/** Home and work folders of a machine, and pointers out of the repository to a shared folder. */
const MACHINE_PATH = /(^|[\s"'`(=:])\/(work|home|Users|mnt|media)\/[A-Za-z0-9._-]|\.\.\/shared\b|\bshared\/science\b|\b[A-Z]:\\(Users|work)\\/;
/** A pointer to a tracker this repository does not have; comments say what and why instead. */
const TRACKER_NUMBER = /\bissue\s*#?\d+/i;
/** Built from parts, so this file does not hold the strings it looks for. */
const joined = (...parts: string[]) => parts.join('');

describe('no machine paths in the repository', () => {
  it('no tracked text file names a folder outside the repository or an issue number', () => {
    const files = execFileSync('git', ['ls-files', '-z'], { cwd: root, encoding: 'utf8' })
      .split('\0')
      .filter((file) => file && !file.startsWith('assets/') && file !== 'package-lock.json' && fs.existsSync(path.join(root, file)));
    expect(files.length).toBeGreaterThan(100);
    const offenders: string[] = [];
    for (const file of files) {
      const text = fs.readFileSync(path.join(root, file), 'utf8');
      text.split('\n').forEach((line, index) => {
        // Journal issue numbers in data files are fine; code, docs and scripts say no tracker numbers.
        const isCodeOrDoc = /\.(ts|tsx|js|cjs|mjs|md|sh)$/.test(file) || file.startsWith('.ci/');
        if (MACHINE_PATH.test(line) || (isCodeOrDoc && TRACKER_NUMBER.test(line))) offenders.push(`${file}:${index + 1}: ${line.trim().slice(0, 120)}`);
      });
    }
    expect(offenders).toEqual([]);
  });

  it('the patterns catch what they are meant to catch', () => {
    for (const line of [
      joined('see /wo', 'rk/sha', 'red/science/x.json'),
      joined('"source": "/ho', 'me/ana/notes.txt"'),
      joined("import x from '../sha", "red/PRODUCT.md'"),
      joined('C:\\Us', 'ers\\ana\\data.json'),
    ]) {
      expect(MACHINE_PATH.test(line)).toBe(true);
    }
    expect(TRACKER_NUMBER.test(joined('// see iss', 'ue 16'))).toBe(true);
    expect(TRACKER_NUMBER.test(joined('// fixes iss', 'ue #7'))).toBe(true);
    expect(TRACKER_NUMBER.test('// the issued date is 1991')).toBe(false);
    for (const line of [joined('/usr/lib/', 'postgresql/*/bin'), 'server/dev/fake-works.json', 'https://example.org/work/1', '/api/dev/outbox']) {
      expect(MACHINE_PATH.test(line)).toBe(false);
    }
  });
});

describe('the fake DOI service’s records', () => {
  const works = fakeWorks.works as {
    doi: string;
    title: string | null;
    authors: { given?: string; family: string }[];
    journal: string;
    year: number;
    volume: string;
    page: string;
    source: string;
    heldIn: string[];
    checked: string;
    note?: string;
  }[];
  const dataFiles = fs.readdirSync(path.join(root, 'data')).filter((file) => file.endsWith('.json'));

  it.each(works.map((work) => ({ work })))('$work.doi: a clean source, how it was checked, and the data files here that cite it', ({ work }) => {
    expect(CHECKED).toContain(work.checked);
    // The source is a citation: authors, journal, year, volume, pages, DOI — no file names, no notes.
    expect(work.source).toContain(work.journal);
    expect(work.source).toContain(String(work.year));
    expect(work.source).toContain(`doi:${work.doi}`);
    for (const author of work.authors) expect(work.source).toContain(author.family);
    expect(work.source).not.toMatch(/\.json|notes|\(/);

    // Every data file that cites the DOI is named, and every named one does.
    const citing = dataFiles.filter((file) => fs.readFileSync(path.join(root, 'data', file), 'utf8').includes(work.doi)).map((file) => `data/${file}`);
    expect([...work.heldIn].sort()).toEqual(citing.sort());
    expect(citing.length).toBeGreaterThan(0);
  });

  it.each(works.map((work) => ({ work })))('$work.doi: agrees with the citation in data/demo-library.json', ({ work }) => {
    const demo = JSON.parse(fs.readFileSync(path.join(root, 'data/demo-library.json'), 'utf8')) as unknown;
    const found: Record<string, unknown>[] = [];
    const visit = (value: unknown): void => {
      if (Array.isArray(value)) return value.forEach(visit);
      if (!value || typeof value !== 'object') return;
      const record = value as Record<string, unknown>;
      if (record.doi === work.doi && typeof record.journal === 'string') found.push(record);
      Object.values(record).forEach(visit);
    };
    visit(demo);
    expect(found.length).toBeGreaterThan(0);
    for (const citation of found) {
      expect(citation.journal).toBe(work.journal);
      expect(citation.year).toBe(work.year);
      expect(citation.volume).toBe(work.volume);
      expect(citation.pages).toBe(work.page);
      if (citation.title !== null && work.title !== null) expect(citation.title).toBe(work.title);
      const families = String(citation.authors).split(/\s*,\s*/).map((name) => name.split(/\s+/).pop());
      expect(families).toEqual(work.authors.map((author) => author.family));
    }
  });

  describe('as served', () => {
    let fake: FakeMetadataService;
    beforeAll(async () => {
      fake = await startFakeMetadataService();
    });
    afterAll(async () => {
      await fake.close();
    });

    it('answers the bibliographic fields only: no source, data file, check or note', async () => {
      for (const work of works) {
        const response = await fetch(`${fake.url}/works/${encodeURIComponent(work.doi)}`);
        expect(response.status).toBe(200);
        const text = await response.text();
        expect(text).toContain(work.journal);
        for (const hidden of ['heldIn', 'checked', 'note', 'source', 'data/', ...(work.note ? [work.note] : [])]) expect(text).not.toContain(hidden);
      }
    });
  });
});
