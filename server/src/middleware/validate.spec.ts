import express from 'express';
import request from 'supertest';
import { z } from 'zod';
import { errorHandler } from './error-handler';
import { IdParams, intText, INT4_MAX, positiveIntText, validate } from './validate';

describe('validate', () => {
  const app = express();
  app.set('query parser', 'simple');
  app.use(express.json());
  const route = validate({
    params: IdParams,
    query: z.object({ page: intText(1, 1000).default(1) }),
    body: z.object({ note: z.string().max(10) }).strict(),
  });
  app.post('/items/:id', route, (_req, res) => {
    const { params, query, body } = route.input(res);
    // Typed: params.id and query.page are numbers, body.note a string.
    res.json({ id: params.id + 0, page: query.page + 0, note: body.note.toUpperCase() });
  });
  app.use(errorHandler);

  it('stores the parsed, typed input in res.locals', async () => {
    const res = await request(app).post('/items/42?page=3').send({ note: 'kestrel' }).expect(200);
    expect(res.body).toEqual({ id: 42, page: 3, note: 'KESTREL' });
  });

  it('applies defaults', async () => {
    const res = await request(app).post('/items/7').send({ note: 'x' }).expect(200);
    expect(res.body.page).toBe(1);
  });

  it.each([
    ['/items/2147483648', { note: 'x' }, 'id'],
    ['/items/7?page=0', { note: 'x' }, 'page'],
    ['/items/7', { note: 'x', extra: 1 }, 'extra'],
  ])('answers 400 validation_error for %s', async (url, body, field) => {
    const res = await request(app).post(url).send(body).expect(400);
    expect(res.body.error.code).toBe('validation_error');
    expect(res.body.error.message).toContain(field);
  });
});

describe('positiveIntText', () => {
  const id = positiveIntText();
  it('takes plain decimal digits up to the column maximum', () => {
    expect(id.parse('1')).toBe(1);
    expect(id.parse(String(INT4_MAX))).toBe(INT4_MAX);
  });
  it.each(['0', '-1', '01', '1e3', '0x10', ' 7', '7 ', '1.5', '', String(INT4_MAX + 1)])(
    'refuses %p',
    (v) => expect(id.safeParse(v).success).toBe(false),
  );
  it('takes a wider range for bigint keys, up to 2^53 − 1', () => {
    const big = positiveIntText(Number.MAX_SAFE_INTEGER);
    expect(big.parse('9007199254740991')).toBe(Number.MAX_SAFE_INTEGER);
    expect(big.safeParse('9007199254740992').success).toBe(false);
  });
});
