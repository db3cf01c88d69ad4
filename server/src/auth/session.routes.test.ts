import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase, type TestDatabase } from '../../../test/support/test-database.js';
import { createApp } from '../app.js';
import { createLogger } from '../shared/logger.js';
import { anonymousAgent, createTestPerson, CSRF_HEADER, signedInAgent, type TestPerson } from './auth-test-support.js';

describe('session routes', () => {
  let db: TestDatabase;
  let app: ReturnType<typeof createApp>;
  let analyst: TestPerson;
  beforeAll(async () => {
    db = await createTestDatabase();
    app = createApp({ settings: db.settings, sequelize: db.sequelize, logger: createLogger('silent') });
    analyst = await createTestPerson('analyst');
  });
  afterAll(async () => {
    await db.drop();
  });

  it('signs a person in with the right password and answers who they are', async () => {
    const { agent } = await signedInAgent(app, analyst);
    const res = await agent.get('/api/session').expect(200);
    expect(res.body.principal).toMatchObject({ kind: 'person', userName: analyst.userName, role: 'analyst' });
  });

  it('refuses a wrong password with UNAUTHENTICATED', async () => {
    const { agent, csrf } = await anonymousAgent(app);
    const res = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ userName: analyst.userName, password: 'wrong-password-x' }).expect(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
  });

  it('answers an anonymous caller with no principal', async () => {
    const res = await request(app).get('/api/session').expect(200);
    expect(res.body).toEqual({ principal: null });
  });
});
