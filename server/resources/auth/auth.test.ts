import jwt from 'jsonwebtoken';
import { testApp } from '../../test-support/app';

let t: Awaited<ReturnType<typeof testApp>>;
beforeAll(async () => {
  t = await testApp();
});
afterAll(() => t.close());

const expectErrorShape = (body: unknown, code: string) => {
  expect(body).toEqual({ error: expect.objectContaining({ code, message: expect.any(String) }) });
  expect(JSON.stringify(body)).not.toMatch(/at .+\.(ts|js):\d+/); // never a stack trace
};

describe('POST /api/auth/login', () => {
  it('returns a token and the user for the right email and password', async () => {
    const u = await t.signedIn('engineer');
    const res = await t.http().post('/api/auth/login').send({ email: u.email.toUpperCase(), password: u.password });
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({ id: u.id, email: u.email, name: 'Test engineer', role: 'engineer' });
    const me = await t.http().get('/api/auth/me').set('Authorization', `Bearer ${res.body.token}`);
    expect(me.body.user.email).toBe(u.email);
  });

  it('refuses a wrong password with 401 invalid_credentials', async () => {
    const u = await t.signedIn('operator');
    const res = await t.http().post('/api/auth/login').send({ email: u.email, password: 'not-the-password' });
    expect(res.status).toBe(401);
    expectErrorShape(res.body, 'invalid_credentials');
  });

  it('answers an unknown user exactly as a wrong password, so accounts cannot be probed', async () => {
    const res = await t
      .http()
      .post('/api/auth/login')
      .send({ email: `nobody-${t.unique()}@test.tallyrun`, password: 'whatever-it-is' });
    expect(res.status).toBe(401);
    expectErrorShape(res.body, 'invalid_credentials');
  });

  it('answers a disabled account with the right password exactly as a wrong password, auditing the true reason', async () => {
    const u = await t.signedIn('accountant');
    await t.sequelize.query('UPDATE users SET disabled = true WHERE id = :id', { replacements: { id: u.id } });
    const disabled = await t.http().post('/api/auth/login').send({ email: u.email, password: u.password });
    const wrong = await t.http().post('/api/auth/login').send({ email: u.email, password: 'not-the-password' });
    const unknown = await t
      .http()
      .post('/api/auth/login')
      .send({ email: `nobody-${t.unique()}@test.tallyrun`, password: u.password });
    expect([disabled.status, wrong.status, unknown.status]).toEqual([401, 401, 401]);
    expectErrorShape(disabled.body, 'invalid_credentials');
    expect(disabled.body).toEqual(wrong.body);
    expect(unknown.body).toEqual(wrong.body);
    const [rows] = await t.sequelize.query(
      "SELECT after->>'why' AS why FROM audit_events WHERE entity_type = 'sign-in' AND after->>'email' = :email ORDER BY chain_seq",
      { replacements: { email: u.email } },
    );
    expect(rows).toEqual([{ why: 'account-disabled' }, { why: 'wrong-password' }]);
  });

  it('spends a bcrypt comparison on an unknown email, as on a real account', async () => {
    // Not a timing assertion on the answer's exactness: only that an unknown email is not answered
    // in a fraction of the time a real account takes (before: 3–8 ms against 62–76 ms).
    const u = await t.signedIn('operator');
    const timed = async (email: string) => {
      const started = process.hrtime.bigint();
      const res = await t.http().post('/api/auth/login').send({ email, password: 'not-the-password' });
      expect(res.status).toBe(401);
      return Number(process.hrtime.bigint() - started) / 1e6;
    };
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 5; i++) {
      known.push(await timed(u.email));
      unknown.push(await timed(`nobody-${t.unique()}@test.tallyrun`));
    }
    const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
    expect(median(unknown)).toBeGreaterThan(median(known) * 0.5);
  });

  it('names the missing field of an incomplete body with 400', async () => {
    const res = await t.http().post('/api/auth/login').send({ password: 'x' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('email');
  });

  it('answers a malformed JSON body with 400 naming the body', async () => {
    const res = await t.http().post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expectErrorShape(res.body, 'invalid_json');
    expect(res.body.error.field).toBe('body');
  });

  it('counts an email with spaces around it or other letter case against the same account limit', async () => {
    const limited = await testApp({ loginLimit: 3 });
    try {
      const email = `target-${limited.unique()}@test.tallyrun`;
      const variants = [email, `  ${email}`, `${email.toUpperCase()} `, ` Target${email.slice(6)}`];
      const statuses: number[] = [];
      for (const variant of variants)
        statuses.push(
          (await limited.http().post('/api/auth/login').send({ email: variant, password: 'guess-guess' })).status,
        );
      expect(statuses).toEqual([401, 401, 401, 429]);
    } finally {
      await limited.close();
    }
  });

  it('signs a user in with spaces around the email, as the same account', async () => {
    const u = await t.signedIn('operator');
    const res = await t
      .http()
      .post('/api/auth/login')
      .send({ email: ` ${u.email.toUpperCase()} `, password: u.password });
    expect(res.status).toBe(200);
    expect(res.body.user.id).toBe(u.id);
  });

  it('does not let a rotated X-Forwarded-For reset the limit when no proxy is trusted', async () => {
    const limited = await testApp({ loginLimit: 2 });
    try {
      const email = `rotated-${limited.unique()}@test.tallyrun`;
      const statuses: number[] = [];
      for (let i = 1; i <= 4; i++)
        statuses.push(
          (
            await limited
              .http()
              .post('/api/auth/login')
              .set('X-Forwarded-For', `203.0.113.${i}`)
              .send({ email, password: 'guess-guess' })
          ).status,
        );
      expect(statuses).toEqual([401, 401, 429, 429]);
    } finally {
      await limited.close();
    }
  });

  it('rate-limits repeated sign-in attempts for one account with 429', async () => {
    const limited = await testApp({ loginLimit: 3 });
    try {
      const email = `target-${limited.unique()}@test.tallyrun`;
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++)
        statuses.push((await limited.http().post('/api/auth/login').send({ email, password: 'guess-guess' })).status);
      expect(statuses).toEqual([401, 401, 401, 429, 429]);
      const last = await limited.http().post('/api/auth/login').send({ email, password: 'guess-guess' });
      expectErrorShape(last.body, 'rate_limited');
    } finally {
      await limited.close();
    }
  });
});

describe('bearer tokens', () => {
  it('refuses a request without a token with 401', async () => {
    const res = await t.http().get('/api/auth/me');
    expect(res.status).toBe(401);
    expectErrorShape(res.body, 'unauthorized');
  });

  it('refuses an expired token with 401 token_expired', async () => {
    const u = await t.signedIn('operator');
    const expired = jwt.sign({ role: 'operator', exp: Math.floor(Date.now() / 1000) - 60 }, t.jwtSecret, {
      subject: u.id,
    });
    const res = await t.http().get('/api/auth/me').set('Authorization', `Bearer ${expired}`);
    expect(res.status).toBe(401);
    expectErrorShape(res.body, 'token_expired');
  });

  it('refuses a token signed with another secret with 401', async () => {
    const u = await t.signedIn('admin');
    const forged = jwt.sign({ role: 'admin' }, 'a-secret-that-is-not-the-servers', { subject: u.id });
    const res = await t.http().get('/api/users').set('Authorization', `Bearer ${forged}`);
    expect(res.status).toBe(401);
  });

  it('refuses an unsigned ("alg: none") token with 401', async () => {
    const u = await t.signedIn('admin');
    const unsigned = jwt.sign({ role: 'admin' }, '', { subject: u.id, algorithm: 'none' });
    const res = await t.http().get('/api/users').set('Authorization', `Bearer ${unsigned}`);
    expect(res.status).toBe(401);
  });

  it('stops honouring a valid token as soon as its user is disabled', async () => {
    const u = await t.signedIn('engineer');
    expect((await t.http().get('/api/auth/me').set('Authorization', `Bearer ${u.token}`)).status).toBe(200);
    await t.sequelize.query('UPDATE users SET disabled = true WHERE id = :id', { replacements: { id: u.id } });
    expect((await t.http().get('/api/auth/me').set('Authorization', `Bearer ${u.token}`)).status).toBe(401);
  });

  it('answers an unknown API route with a 404 in the error shape', async () => {
    const u = await t.signedIn('operator');
    const res = await t.http().get('/api/no-such-thing').set('Authorization', `Bearer ${u.token}`);
    expect(res.status).toBe(404);
    expectErrorShape(res.body, 'not_found');
  });
});

describe('token versions', () => {
  const as = (token: string) => ({ Authorization: `Bearer ${token}` });
  const me = (token: string) => t.http().get('/api/auth/me').set(as(token));
  const signIn = async (email: string, password: string) => {
    const res = await t.http().post('/api/auth/login').send({ email, password });
    expect(res.status).toBe(200);
    return res.body.token as string;
  };

  it.each([
    ['a password change', { password: 'a-new-long-passphrase' }],
    ['a role change', { role: 'engineer' }],
    ['disabling the account', { disabled: true }],
  ])('stops a token issued before %s with 401 token_revoked; a fresh sign-in works', async (_what, change) => {
    const admin = await t.signedIn('admin');
    const u = await t.signedIn('operator');
    const before = await signIn(u.email, u.password);
    expect((await me(before)).status).toBe(200);
    const patched = await t.http().patch(`/api/users/${u.id}`).set(as(admin.token)).send(change);
    expect(patched.status).toBe(200);
    for (const token of [before, u.token]) {
      const res = await me(token);
      expect(res.status).toBe(401);
      expectErrorShape(res.body, 'token_revoked');
      expect(res.body.error.message).toMatch(/sign in again/);
    }
    if ('disabled' in change) {
      await t.http().patch(`/api/users/${u.id}`).set(as(admin.token)).send({ disabled: false });
      expect((await me(before)).status).toBe(401); // re-enabling does not bring old tokens back
    }
    const fresh = await signIn(u.email, 'password' in change ? change.password : u.password);
    expect((await me(fresh)).status).toBe(200);
  });

  it('keeps tokens working across a change of name only', async () => {
    const admin = await t.signedIn('admin');
    const u = await t.signedIn('operator');
    await t.http().patch(`/api/users/${u.id}`).set(as(admin.token)).send({ name: 'Renamed', role: 'operator' });
    expect((await me(u.token)).status).toBe(200);
  });
});

describe('sign-ins in the audit trail', () => {
  const signInEvents = async (email: string) => {
    const [rows] = await t.sequelize.query(
      "SELECT action, actor_email, after FROM audit_events WHERE entity_type = 'sign-in' AND (actor_email = :email OR after->>'email' = :email) ORDER BY chain_seq",
      { replacements: { email } },
    );
    return rows as { action: string; actor_email: string | null; after: { email: string; why: string } | null }[];
  };

  it('records a sign-in under the user and a refusal with the email typed and why, never the password', async () => {
    const u = await t.signedIn('accountant');
    await t.http().post('/api/auth/login').send({ email: u.email, password: 'not-the-password' });
    await t.http().post('/api/auth/login').send({ email: u.email, password: u.password });
    const events = await signInEvents(u.email);
    expect(events).toEqual([
      { action: 'auth.sign-in-refused', actor_email: null, after: { email: u.email, why: 'wrong-password' } },
      { action: 'auth.sign-in', actor_email: u.email, after: null },
    ]);
    expect(JSON.stringify(events)).not.toContain('not-the-password');
  });
});
