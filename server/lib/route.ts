// Typed route handlers: params, query and body are parsed with the shared zod schemas
// before the handler runs, and whatever the handler returns is sent as JSON.
// (A plain middleware cannot hand typed values on in Express 5, where req.query is
// read-only; this wrapper is the simpler shape of the same idea.)
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { z, ZodType } from 'zod';
import type { Db } from '../db/client.js';
import { assertStorableText, fromZod } from './http-error.js';
import { readCacheOf } from './read-cache.js';

type Schemas = { params?: ZodType; query?: ZodType; body?: ZodType };
type Parsed<S extends Schemas> = {
  params: S['params'] extends ZodType ? z.output<S['params']> : Record<string, string>;
  query: S['query'] extends ZodType ? z.output<S['query']> : unknown;
  body: S['body'] extends ZodType ? z.output<S['body']> : unknown;
};

export function route<S extends Schemas>(
  schemas: S,
  handler: (input: Parsed<S>, req: Request, res: Response) => Promise<unknown> | unknown,
  opts: {
    status?: number;
    /**
     * A read whose answer depends only on the caller, the address, the database and the
     * date: keep it while the database is unchanged (read-cache.ts). Its handler returns a
     * value and never writes to `res`.
     */
    cacheIn?: Db;
  } = {},
): RequestHandler {
  return async (req: Request, res: Response, _next: NextFunction) => {
    const input = {
      params: parse(schemas.params, req.params, 'address'),
      query: parse(schemas.query, req.query, 'query'),
      body: parse(schemas.body, req.body ?? {}, 'form'),
    } as Parsed<S>;
    if (opts.cacheIn && req.method === 'GET' && req.actor && req.dbState) {
      const key = `${req.actor.id}|${req.originalUrl}`;
      const { body, etag } = await readCacheOf(opts.cacheIn).answer(req.dbState, key, async () => handler(input, req, res));
      // Express answers 304 itself when the ETag matches the request's If-None-Match.
      res.status(200).set('ETag', etag).type('json').send(body);
      return;
    }
    const result = await handler(input, req, res);
    if (res.headersSent) return;
    if (result === undefined) res.status(204).end();
    else res.status(opts.status ?? 200).json(result);
  };
}

function parse(schema: ZodType | undefined, value: unknown, where: string) {
  if (!schema) return value;
  const r = schema.safeParse(value);
  if (!r.success) throw fromZod(r.error, where);
  assertStorableText(r.data, where);
  return r.data;
}
