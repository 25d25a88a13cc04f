import { testApp } from '../../test-support/app';

let t: Awaited<ReturnType<typeof testApp>>;
let admin: Awaited<ReturnType<typeof t.signedIn>>;
beforeAll(async () => {
  t = await testApp();
  admin = await t.signedIn('admin');
});
afterAll(() => t.close());

const as = (token: string) => ({ Authorization: `Bearer ${token}` });

async function auditFor(entityId: string) {
  const [rows] = await t.sequelize.query(
    'SELECT action, actor_email, before, after FROM audit_events WHERE entity_type = :type AND entity_id = :id ORDER BY id',
    { replacements: { type: 'user', id: entityId } },
  );
  return rows as {
    action: string;
    actor_email: string;
    before: Record<string, unknown> | null;
    after: Record<string, unknown> | null;
  }[];
}

describe('/api/users (admin)', () => {
  it('creates a user who can then sign in, and records who created it', async () => {
    const email = `new-${t.unique()}@test.tallyrun`;
    const res = await t
      .http()
      .post('/api/users')
      .set(as(admin.token))
      .send({ email, name: 'New Person', role: 'operator', password: 'a-long-password' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, name: 'New Person', role: 'operator', disabled: false });
    expect(res.body.passwordHash).toBeUndefined();
    const login = await t.http().post('/api/auth/login').send({ email, password: 'a-long-password' });
    expect(login.status).toBe(200);
    const audit = await auditFor(res.body.id);
    expect(audit).toEqual([expect.objectContaining({ action: 'user.create', actor_email: admin.email, before: null })]);
  });

  it('lists users without their password hashes', async () => {
    const res = await t.http().get('/api/users').set(as(admin.token));
    expect(res.status).toBe(200);
    expect(res.body.find((u: { email: string }) => u.email === admin.email)).toMatchObject({
      role: 'admin',
      disabled: false,
    });
    expect(JSON.stringify(res.body)).not.toMatch(/password/i);
  });

  it('changes a role and keeps the value before and after in the audit log', async () => {
    const u = await t.signedIn('operator');
    const res = await t.http().patch(`/api/users/${u.id}`).set(as(admin.token)).send({ role: 'engineer' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('engineer');
    const audit = await auditFor(u.id);
    expect(audit[0]).toMatchObject({
      action: 'user.update',
      before: { role: 'operator' },
      after: { role: 'engineer' },
    });
  });

  it('disables a user, whose sign-in is then refused', async () => {
    const u = await t.signedIn('accountant');
    const res = await t.http().patch(`/api/users/${u.id}`).set(as(admin.token)).send({ disabled: true });
    expect(res.body.disabled).toBe(true);
    expect((await t.http().post('/api/auth/login').send({ email: u.email, password: u.password })).status).toBe(401);
  });

  it('refuses a second user with the same email (in any letter case) with 409', async () => {
    const u = await t.signedIn('operator');
    const res = await t
      .http()
      .post('/api/users')
      .set(as(admin.token))
      .send({ email: u.email.toUpperCase(), name: 'Twin', role: 'operator', password: 'a-long-password' });
    expect(res.status).toBe(409);
    expect(res.body.error.field).toBe('email');
  });

  it.each([
    [{ email: 'not-an-email', name: 'X', role: 'operator', password: 'a-long-password' }, 'email'],
    [{ email: 'ok@test.tallyrun', name: '', role: 'operator', password: 'a-long-password' }, 'name'],
    [{ email: 'ok@test.tallyrun', name: 'X', role: 'superuser', password: 'a-long-password' }, 'role'],
    [{ email: 'ok@test.tallyrun', name: 'X', role: 'operator', password: 'short' }, 'password'],
  ])('refuses a bad new user %j with 400 naming %s', async (body, field) => {
    const res = await t.http().post('/api/users').set(as(admin.token)).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(field);
  });

  it.each([
    ['password', /at least 12 characters/],
    ['aaaaaaaaaaaa', /repeated/],
    ['            ', /only spaces/],
    ['123456789012', /sequence/],
    ['Password 2026!', /common password/],
    ['tallyrun-demo', /product name/],
    ['x'.repeat(129), /at most 128 characters/],
  ])('refuses a new user whose password is %j with 400 naming password and why', async (password, reason) => {
    const body = { email: `weak-${t.unique()}@test.tallyrun`, name: 'Weak', role: 'operator', password };
    const res = await t.http().post('/api/users').set(as(admin.token)).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('password');
    expect(res.body.error.message).toMatch(reason);
  });

  it("counts a password's length in characters, not bytes, and allows spaces", async () => {
    const email = `unicode-${t.unique()}@test.tallyrun`;
    const short = 'ñandú 🌵 ñu'; // 10 characters, 16 bytes
    const ok = 'ñandú 🌵 ñu y yo'; // 15 characters
    const body = { email, name: 'Unicode', role: 'operator' };
    expect(
      (
        await t
          .http()
          .post('/api/users')
          .set(as(admin.token))
          .send({ ...body, password: short })
      ).status,
    ).toBe(400);
    expect(
      (
        await t
          .http()
          .post('/api/users')
          .set(as(admin.token))
          .send({ ...body, password: ok })
      ).status,
    ).toBe(201);
  });

  it('refuses a password change to the email name with a little added, naming password', async () => {
    const u = await t.signedIn('operator');
    const name = u.email.split('@')[0];
    const res = await t
      .http()
      .patch(`/api/users/${u.id}`)
      .set(as(admin.token))
      .send({ password: `${name}2026!` });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('password');
    expect(res.body.error.message).toMatch(/email name/);
  });

  it('stores a new email trimmed and lower-cased, the form sign-in finds', async () => {
    const email = `Mixed-${t.unique()}@Test.Tallyrun`;
    const res = await t
      .http()
      .post('/api/users')
      .set(as(admin.token))
      .send({ email: `  ${email} `, name: 'Mixed', role: 'operator', password: 'a-long-password' });
    expect(res.status).toBe(201);
    expect(res.body.email).toBe(email.toLowerCase());
  });

  it('refuses an unknown field in a change with 400', async () => {
    const u = await t.signedIn('operator');
    const res = await t
      .http()
      .patch(`/api/users/${u.id}`)
      .set(as(admin.token))
      .send({ email: 'changed@test.tallyrun' });
    expect(res.status).toBe(400);
  });

  it('does not let an admin disable or demote their own account', async () => {
    const res = await t.http().patch(`/api/users/${admin.id}`).set(as(admin.token)).send({ disabled: true });
    expect(res.status).toBe(409);
    expect(res.body.error.field).toBe('disabled');
  });

  it('answers a change to a user that does not exist with 404', async () => {
    const res = await t.http().patch('/api/users/987654321').set(as(admin.token)).send({ name: 'Ghost' });
    expect(res.status).toBe(404);
  });
});
