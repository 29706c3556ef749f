import express from 'express';
import request from 'supertest';
import { AppSetting } from '@/server/modules/settings/app-setting.entity';
import { openOrm, type Orm } from '@/server/db/orm';
import { requestContext, requestEm } from '@/server/db/request-context';
import { createTestDatabase } from '../setup/test-database';

/**
 * One entity manager per request (MikroORM's RequestContext): within a request every service sees
 * the same manager and identity map; two requests never share one; outside a request there is none.
 */
let orm: Orm;
let drop: () => Promise<void>;

beforeAll(async () => {
  const database = await createTestDatabase();
  drop = database.drop;
  orm = await openOrm(database.url);
});
afterAll(async () => {
  await orm.close(true);
  await drop();
});

function probeApp() {
  const app = express();
  app.use(requestContext(orm));
  app.get('/probe', async (_req, res) => {
    const first = requestEm();
    const a = await first.find(AppSetting, {});
    // A second look-up later in the same request, as a second service would make it.
    const second = await Promise.resolve().then(() => requestEm());
    const b = await second.find(AppSetting, {});
    res.json({
      managerId: first.id,
      sameManager: first === second,
      sameInstances: a.length > 0 && a.every((row, i) => row === b[i]),
      isGlobal: first === orm.em,
    });
  });
  return app;
}

it('gives each request one manager of its own, shared by everything the request runs', async () => {
  await orm.em.fork().getConnection().execute(`insert into app_setting (key, value, updated_at) values ('probe', '{"x": 1}', now()) on conflict do nothing`);
  const app = probeApp();
  const one = await request(app).get('/probe').expect(200);
  const two = await request(app).get('/probe').expect(200);
  expect(one.body).toMatchObject({ sameManager: true, sameInstances: true, isGlobal: false });
  expect(two.body).toMatchObject({ sameManager: true, sameInstances: true, isGlobal: false });
  expect(one.body.managerId).not.toBe(two.body.managerId);
});

it('has no request manager outside a request (background work forks its own)', () => {
  expect(() => requestEm()).toThrow(/No request context/);
});
