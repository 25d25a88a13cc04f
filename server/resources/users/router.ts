import { Router } from 'express';
import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { User } from '../../models';
import { requireCapability } from '../../auth/passport';
import { hashPassword } from '../../auth/passwords';
import { recordAuditEvent } from '../../audit';
import { badRequest, conflict, notFound } from '../../errors';
import { validate } from '../../http/validate';
import { createUserSchema, updateUserSchema } from './schema';
import { presentUser } from './presenter';

export function usersRouter(sequelize: Sequelize) {
  const router = Router();
  router.use(requireCapability('administer'));

  router.get('/', async (_req, res) => {
    const users = await User.findAll({ order: [['id', 'ASC']] });
    res.json(users.map((u) => presentUser(u)));
  });

  router.post('/', async (req, res) => {
    const input = validate(createUserSchema, req.body);
    const passwordHash = await hashPassword(input.password);
    try {
      const user = await sequelize.transaction(async (transaction) => {
        const created = await User.create(
          { email: input.email, name: input.name, role: input.role, passwordHash },
          { transaction },
        );
        await recordAuditEvent(
          {
            actor: req.user!,
            action: 'user.create',
            entityType: 'user',
            entityId: String(created.id),
            after: presentUser(created),
          },
          transaction,
        );
        return created;
      });
      res.status(201).json(presentUser(user));
    } catch (err) {
      if (err instanceof UniqueConstraintError)
        throw conflict('A user with this email already exists.', 'email', 'duplicate');
      throw err;
    }
  });

  router.patch('/:id', async (req, res) => {
    const input = validate(updateUserSchema, req.body);
    if (Object.keys(input).length === 0)
      throw badRequest('Give at least one of name, role, disabled, password.', 'body');
    const id = req.params.id;
    if (!/^\d+$/.test(id)) throw notFound('User');
    if (id === req.user!.id && (input.disabled === true || (input.role && input.role !== 'admin'))) {
      // An admin who disables or demotes themselves can lock everyone out of administration.
      throw conflict('You cannot disable or demote your own account.', input.disabled ? 'disabled' : 'role');
    }
    const user = await sequelize.transaction(async (transaction) => {
      const found = await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!found) throw notFound('User');
      const before = presentUser(found);
      if (input.name !== undefined) found.name = input.name;
      if (input.role !== undefined) found.role = input.role;
      if (input.disabled !== undefined) found.disabled = input.disabled;
      if (input.password !== undefined) found.passwordHash = await hashPassword(input.password);
      await found.save({ transaction });
      const after = presentUser(found);
      const action = input.password !== undefined ? 'user.update-with-password' : 'user.update';
      await recordAuditEvent(
        { actor: req.user!, action, entityType: 'user', entityId: id, before, after },
        transaction,
      );
      return found;
    });
    res.json(presentUser(user));
  });

  return router;
}
