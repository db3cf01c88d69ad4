import express, { Router } from 'express';
import { describe, expect, it } from 'vitest';
import { registeredRoutes } from './route-inventory.js';

describe('registeredRoutes', () => {
  it('names routes of routers mounted with and without a path, with every method of a route', () => {
    const app = express();
    const flat = Router();
    flat.get('/things', (_req, res) => res.end());
    const nested = Router();
    nested.route('/:id').get((_req, res) => res.end()).patch((_req, res) => res.end());
    const api = Router();
    api.use(flat);
    api.use('/boxes', nested);
    app.use('/api', api);
    app.get('/*splat', (_req, res) => res.end());
    expect(registeredRoutes(app)).toEqual(['GET /*splat', 'GET /api/boxes/:id', 'GET /api/things', 'PATCH /api/boxes/:id']);
  });
});
