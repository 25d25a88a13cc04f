import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireCapability } from '../../auth/passport';
import { badRequest } from '../../errors';
import { parseId } from '../../http/params';
import { validate } from '../../http/validate';
import { createUserSchema, updateUserSchema } from './schema';
import { usersRepository } from './repository';
import { createUser, listUsers, updateUser } from './use-cases';
import { presentUser } from './presenter';

/** Users (admin only): list, create, and change name, role, disabled or password. */
export function usersRouter(sequelize: Sequelize) {
  const router = Router();
  const repository = usersRepository(sequelize);
  router.use(requireCapability('administer'));

  router.get('/', async (_req, res) => {
    res.json((await listUsers(repository)).map((u) => presentUser(u)));
  });

  router.post('/', async (req, res) => {
    const input = validate(createUserSchema, req.body);
    res.status(201).json(presentUser(await createUser(repository, input, req.user!)));
  });

  router.patch('/:id', async (req, res) => {
    const input = validate(updateUserSchema, req.body);
    if (Object.keys(input).length === 0)
      throw badRequest('Give at least one of name, role, disabled, password.', 'body');
    const id = parseId(req.params.id, 'User');
    res.json(presentUser(await updateUser(repository, id, input, req.user!)));
  });

  return router;
}
