import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { errorHandler } from './error-handler.js';
import { createLogger } from './logger.js';
import { validate } from './validate.js';

function appWith(): express.Express {
  const app = express();
  app.use(express.json());
  const check = validate({
    params: z.object({ id: z.string().regex(/^\d+$/).transform(Number) }),
    query: z.object({ page: z.coerce.number().int().min(1).default(1) }),
    body: z.strictObject({ note: z.string().max(5) }),
  });
  app.post('/things/:id', check, (req, res) => {
    const { params, query, body } = check.of(req);
    res.json({ id: params.id, page: query.page, note: body.note });
  });
  app.use(errorHandler(createLogger('silent')));
  return app;
}

describe('validate()', () => {
  it('hands the handler the parsed, typed params, query and body', async () => {
    const res = await request(appWith()).post('/things/42?page=3').send({ note: 'ok' }).expect(200);
    expect(res.body).toEqual({ id: 42, page: 3, note: 'ok' });
  });

  it('answers VALIDATION_FAILED listing every issue with its part and path', async () => {
    const res = await request(appWith()).post('/things/x?page=0').send({ note: 'too long', extra: 1 }).expect(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    const where = (res.body.error.details.issues as { in: string; path: string }[]).map((i) => `${i.in}:${i.path}`);
    expect(where).toEqual(expect.arrayContaining(['params:id', 'query:page', 'body:note', 'body:']));
    expect(res.body.error.message).toMatch(/^Invalid request params at id: /);
  });
});
