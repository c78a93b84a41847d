import { Router } from 'express';
import { ping, type Database } from '../db/database.js';

export function healthRouter(db: Database): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await ping(db);
      res.json({ status: 'ok', db: 'up' });
    } catch {
      res.status(503).json({ status: 'degraded', db: 'down' });
    }
  });
  return router;
}
