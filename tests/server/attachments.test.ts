import { createHash } from 'node:crypto';
import { GetObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { attachmentSchema, attachmentListSchema } from '@/lib/schemas/exchange';
import { createApp } from '@/server/app';
import { Attachment } from '@/server/modules/attachments/attachment.entity';
import { startFakeS3 } from '@/server/dev/fake-s3';
import { createS3Storage, type S3Settings } from '@/server/modules/attachments/object-storage';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, entryInState, type LibraryWorld } from '../factories/library-world';
import request from 'supertest';
import { TEST_HOST, TEST_ORIGIN, type Browser } from './auth-helpers';
import { download, upload } from './exchange-helpers';

let t: TestApp;
let w: LibraryWorld;
let s3: { settings: S3Settings; close: () => Promise<void> };
let settleMail: () => Promise<void> = async () => {};
let entryId: string;

// Magic numbers: PDF "%PDF-" (ISO 32000-1 §7.5.2), PNG 89 50 4E 47 0D 0A 1A 0A (PNG spec §5.2), GIF "GIF89a".
const pdf = Buffer.concat([Buffer.from('%PDF-1.7\n%âãÏÓ\n1 0 obj\n<< /Type /Catalog >>\nendobj\n', 'latin1'), Buffer.from([0, 1, 2, 255, 254, 13, 10])]);
const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 1, 2, 3]);
const gif = Buffer.from('GIF89a\x01\x00\x01\x00', 'latin1');
const jcamp = Buffer.from('##TITLE=[Cr(H2O)6]3+ UV-vis\n##JCAMP-DX=4.24\n##DATA TYPE=UV/VIS SPECTRUM\n##XUNITS=NANOMETERS\n##END=\n');
const cif = Buffer.from('data_larkspur_demo\n_cell_length_a 10.0\n_symmetry_space_group_name_H-M \'P 1\'\n');

const path = (id = entryId) => `/api/complexes/${id}/attachments`;
const up = (who: Browser | null, body: Buffer, fileName: string, id = entryId) =>
  upload(t.app, who, `${path(id)}?fileName=${encodeURIComponent(fileName)}`, body, 'application/octet-stream');

/**
 * The author submits the entry's pending revision and a reviewer who wrote none of it accepts it
 * (with its files): the curator, or the admin when the curator attached a file themselves.
 */
async function acceptPending(id = entryId) {
  const submitted = await w.author.post(`/api/complexes/${id}/submit`);
  if (submitted.status !== 200) throw new Error(`submit: ${submitted.status} ${JSON.stringify(submitted.body)}`);
  let accepted = await w.curator.post(`/api/complexes/${id}/reviews`, { decision: 'accept', comment: 'files checked' });
  if (accepted.status === 409) accepted = await w.admin.post(`/api/complexes/${id}/reviews`, { decision: 'accept', comment: 'files checked' });
  if (accepted.status !== 201) throw new Error(`accept: ${accepted.status} ${JSON.stringify(accepted.body)}`);
}

beforeAll(async () => {
  const base = await createTestApp();
  s3 = await startFakeS3();
  // This app sends its own review e-mails: let them finish before the database goes.
  const app = createApp({ orm: base.orm, storage: createS3Storage(s3.settings), onReviewMail: (mail) => (settleMail = () => mail.settle()) });
  t = { ...base, app };
  w = await buildLibraryWorld(t, 'att');
  entryId = (await entryInState(w, 'accepted')).id;
}, 30_000);
afterAll(async () => {
  await settleMail();
  await s3.close();
  await t.close();
});

describe('upload and download', () => {
  it('stores a PDF, reports its SHA-256, and a viewer downloads the same bytes once the entry is accepted with it', async () => {
    const response = await up(w.author, pdf, 'kinetics trace.pdf');
    expect(response.status).toBe(201);
    const attachment = attachmentSchema.parse(response.body);
    expect(attachment.state).toBe('pending');
    // Pending: the author has it, the viewer not yet.
    expect(Buffer.compare((await download(t.app, w.author, attachment.downloadPath)).body as Buffer, pdf)).toBe(0);
    expect((await download(t.app, w.viewer, attachment.downloadPath)).status).toBe(404);
    await acceptPending();
    // SHA-256 (FIPS 180-4) computed here independently of the server.
    expect(attachment.sha256).toBe(createHash('sha256').update(pdf).digest('hex'));
    expect(attachment).toMatchObject({ kind: 'pdf', contentType: 'application/pdf', sizeBytes: pdf.length, fileName: 'kinetics trace.pdf' });

    const got = await download(t.app, w.viewer, attachment.downloadPath);
    expect(got.status).toBe(200);
    expect(Buffer.compare(got.body as Buffer, pdf)).toBe(0);
    expect(got.headers['content-type']).toBe('application/pdf');
    expect(got.headers['content-disposition']).toBe(`attachment; filename="kinetics trace.pdf"; filename*=UTF-8''kinetics%20trace.pdf`);
    expect(got.headers['x-content-type-options']).toBe('nosniff');

    // The bytes in the bucket are the file itself (no aws-chunked framing: PLATFORM trap 13).
    const row = await t.orm.em.fork().findOneOrFail(Attachment, { id: attachment.id });
    expect(row.objectKey).toBe(`attachments/${w.groupId}/${entryId}/${attachment.id}`);
    const client = new S3Client({
      endpoint: s3.settings.endpoint, region: 'us-east-1', forcePathStyle: true,
      credentials: { accessKeyId: s3.settings.accessKeyId, secretAccessKey: s3.settings.secretAccessKey },
      requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED',
    });
    const object = await client.send(new GetObjectCommand({ Bucket: s3.settings.bucket, Key: row.objectKey }));
    const stored = Buffer.from(await (object.Body as { transformToByteArray(): Promise<Uint8Array> }).transformToByteArray());
    expect(createHash('sha256').update(stored).digest('hex')).toBe(attachment.sha256);
    client.destroy();
  });

  it('accepts JCAMP-DX, CIF and PNG by content and name', async () => {
    expect((await up(w.author, jcamp, 'uv-vis.jdx')).body.kind).toBe('jcamp-dx');
    expect((await up(w.author, cif, 'structure.cif')).body.kind).toBe('cif');
    expect((await up(w.curator, png, 'photo.png')).body.kind).toBe('png');
    await acceptPending();
    const list = attachmentListSchema.parse((await w.viewer.get(path())).body);
    expect(list.attachments.map((a) => a.fileName)).toEqual(expect.arrayContaining(['uv-vis.jdx', 'structure.cif', 'photo.png']));
  });

  it('path tricks in file names are harmless: the name is cleaned and never reaches the store key', async () => {
    const response = await up(w.author, cif, '../../../etc/passwd.cif');
    expect(response.status).toBe(201);
    expect(response.body.fileName).toBe('passwd.cif');
    const sneaky = await up(w.author, cif, '..\\..\\x"; filename=evil.exe\r\nX-Injected: 1.cif');
    expect(sneaky.status).toBe(201);
    const row = await t.orm.em.fork().findOneOrFail(Attachment, { id: sneaky.body.id });
    expect(row.objectKey).toMatch(/^attachments\/[0-9a-f-]{36}\/[0-9a-f-]{36}\/[0-9a-f-]{36}$/);
    await acceptPending();
    const got = await download(t.app, w.viewer, sneaky.body.downloadPath);
    expect(got.status).toBe(200);
    expect(got.headers['x-injected']).toBeUndefined();
    expect(got.headers['content-disposition']).not.toMatch(/[\r\n]/);
    expect(got.headers['content-disposition']).toMatch(/^attachment; filename="[^"]*"; filename\*=UTF-8''/);
  });
});

describe('refused files', () => {
  const cases: [string, Buffer, string, number][] = [
    ['a PNG named .pdf', png, 'spectrum.pdf', 415],
    ['a PDF named .png', pdf, 'spectrum.png', 415],
    ['a GIF', gif, 'picture.gif', 415],
    ['an executable name', pdf, 'setup.exe', 415],
    ['text named .jdx without ##TITLE=', cif, 'trace.jdx', 415],
    ['binary junk named .txt', Buffer.from([0x00, 0x01, 0x02, 0xff, 0xfe, 0x00]), 'notes.txt', 415],
    ['Latin-1 text named .csv', Buffer.from([0x54, 0x3d, 0xe9, 0x0a]), 'kinetics.csv', 415],
    ['an empty file', Buffer.alloc(0), 'empty.txt', 400],
  ];
  it.each(cases)('%s', async (_what, body, name, status) => {
    const before = await t.orm.em.fork().count(Attachment, {});
    const response = await up(w.author, body, name);
    expect(response.status).toBe(status);
    expect(response.body.error.message.length).toBeGreaterThan(10);
    expect(await t.orm.em.fork().count(Attachment, {})).toBe(before);
  });

  it('a file over 20 MB → 413', async () => {
    const response = await up(w.author, Buffer.alloc(20 * 1024 * 1024 + 1, 0x61), 'huge.txt');
    expect(response.status).toBe(413);
    expect(response.body.error.message).toContain('20 MB');
  });
});

describe('who may do what (table)', () => {
  type Who = 'admin' | 'curator' | 'author' | 'contributor2' | 'viewer' | 'outsider' | null;
  // [who, list, upload, download, delete]
  const table: [Who, number, number, number, number][] = [
    [null, 401, 401, 401, 401],
    ['outsider', 404, 404, 404, 404],
    ['viewer', 200, 403, 200, 403],
    ['contributor2', 200, 403, 200, 403],
    ['author', 200, 201, 200, 403],
    ['curator', 200, 201, 200, 204],
    ['admin', 200, 201, 200, 204],
  ];
  it.each(table)('%s: list %s, upload %s, download %s, delete %s', async (who, list, add, get, remove) => {
    const browser = who ? w[who] : null;
    const seeded = attachmentSchema.parse((await up(w.curator, cif, 'seed.cif')).body);
    await acceptPending();
    const send = (method: 'get' | 'delete', p: string) => (browser ? browser[method](p) : download(t.app, null, p));
    expect((await (browser ? browser.get(path()) : download(t.app, null, path()))).status).toBe(list);
    expect((await up(browser, cif, 'mine.cif')).status).toBe(add);
    expect((await download(t.app, browser, seeded.downloadPath)).status).toBe(get);
    const deleted = browser
      ? await send('delete', seeded.downloadPath)
      : await request(t.app).delete(seeded.downloadPath).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN);
    expect(deleted.status).toBe(remove);
    if (remove === 204) expect((await download(t.app, w.curator, seeded.downloadPath)).status).toBe(404);
  });

  it('a draft only its author and curators can see: the viewer gets 404 for its files', async () => {
    const draft = await entryInState(w, 'draft');
    expect((await up(w.author, cif, 'draft.cif', draft.id)).status).toBe(201);
    expect((await w.viewer.get(path(draft.id))).status).toBe(404);
    expect((await w.contributor2.get(path(draft.id))).status).toBe(404);
  });
});

describe('files go through review with the entry (role matrix)', () => {
  const listed = async (who: 'viewer' | 'contributor2' | 'author' | 'curator', id: string) =>
    attachmentListSchema.parse((await w[who].get(path(id))).body).attachments.map((a) => [a.fileName, a.state]);

  it('a file added to an accepted entry waits for review; a declined one stays hidden; an accepted one is shown to everyone', async () => {
    const entry = (await entryInState(w, 'accepted')).id;
    const first = attachmentSchema.parse((await up(w.author, cif, 'first.cif', entry)).body);
    // Adding the file is a revision that re-opens the entry for review.
    const detail = await w.author.get(`/api/complexes/${entry}`);
    expect(detail.body).toMatchObject({ status: 'draft', hasPendingRevision: true });
    const history = (await w.author.get(`/api/complexes/${entry}/revisions`)).body as { revisions: { message: string }[] };
    expect(history.revisions[0]?.message).toBe('Attached first.cif');
    for (const who of ['viewer', 'contributor2'] as const) {
      expect(await listed(who, entry)).toEqual([]);
      expect((await download(t.app, w[who], first.downloadPath)).status).toBe(404);
    }
    for (const who of ['author', 'curator'] as const) expect(await listed(who, entry)).toEqual([['first.cif', 'pending']]);

    // While it waits for review no file can be added; a declined revision's file stays with author and curators.
    expect((await w.author.post(`/api/complexes/${entry}/submit`)).status).toBe(200);
    expect((await up(w.author, cif, 'late.cif', entry)).status).toBe(409);
    expect((await w.curator.post(`/api/complexes/${entry}/reviews`, { decision: 'decline', comment: 'wrong structure file' })).status).toBe(201);
    for (const who of ['viewer', 'contributor2'] as const) {
      expect(await listed(who, entry)).toEqual([]);
      expect((await download(t.app, w[who], first.downloadPath)).status).toBe(404);
    }
    expect(await listed('author', entry)).toEqual([['first.cif', 'declined']]);

    // Returned: still pending. Accepted: shown and downloadable for everyone.
    const second = attachmentSchema.parse((await up(w.author, jcamp, 'second.jdx', entry)).body);
    expect((await w.author.post(`/api/complexes/${entry}/submit`)).status).toBe(200);
    expect((await w.curator.post(`/api/complexes/${entry}/reviews`, { decision: 'return', comment: 'add the temperature' })).status).toBe(201);
    expect(await listed('author', entry)).toEqual([['first.cif', 'declined'], ['second.jdx', 'pending']]);
    expect(await listed('viewer', entry)).toEqual([]);
    expect((await w.author.post(`/api/complexes/${entry}/submit`)).status).toBe(200);
    expect((await w.curator.post(`/api/complexes/${entry}/reviews`, { decision: 'accept', comment: 'checked' })).status).toBe(201);
    for (const who of ['viewer', 'contributor2'] as const) {
      expect(await listed(who, entry)).toEqual([['second.jdx', 'accepted']]);
      const got = await download(t.app, w[who], second.downloadPath);
      expect(got.status).toBe(200);
      expect(Buffer.compare(got.body as Buffer, jcamp)).toBe(0);
      expect((await download(t.app, w[who], first.downloadPath)).status).toBe(404);
    }
    const row = await t.orm.em.fork().findOneOrFail(Attachment, { id: second.id });
    expect(row.addedInVersion).not.toBeNull();
    expect(row.acceptedInVersion).toBeGreaterThan(row.addedInVersion!);
  });
});
