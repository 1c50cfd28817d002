import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createUserInput, updateUserInput } from '@shared/schemas/auth';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateBody } from '../../http/validate';
import type { DatabaseSessionStore } from '../sessions/database-session-store';
import { createUser, listUsers, updateUser } from './users.service';

export function usersRouter(dataSource: DataSource, sessionStore: DatabaseSessionStore): Router {
  const router = Router();
  router.use(requirePermission('users:manage'));

  router.get('/', async (_req, res) => {
    res.json({ users: await listUsers(dataSource) });
  });

  router.post('/', validateBody(createUserInput), async (req, res) => {
    res.status(201).json({ user: await createUser(dataSource, req.body) });
  });

  router.patch('/:id', validateBody(updateUserInput), async (req, res) => {
    const user = await updateUser(dataSource, req.user!.id, parseId(req.params.id), req.body);
    if (!user.active) await sessionStore.destroyAllForUser(user.id);
    res.json({ user });
  });

  return router;
}
