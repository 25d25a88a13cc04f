import { testApp } from '../../test-support/app';

let t: Awaited<ReturnType<typeof testApp>>;
let admin: Awaited<ReturnType<typeof t.signedIn>>;
let accountant: Awaited<ReturnType<typeof t.signedIn>>;
beforeAll(async () => {
  t = await testApp();
  admin = await t.signedIn('admin');
  accountant = await t.signedIn('accountant');
});
afterAll(() => t.close());

const get = (token: string, query: string) =>
  t.http().get(`/api/audit-events${query}`).set('Authorization', `Bearer ${token}`);

describe('GET /api/audit-events', () => {
  it('shows who changed a record, when, and the values before and after, newest first', async () => {
    const u = await t.signedIn('operator');
    await t.http().patch(`/api/users/${u.id}`).set('Authorization', `Bearer ${admin.token}`).send({ name: 'First' });
    await t.http().patch(`/api/users/${u.id}`).set('Authorization', `Bearer ${admin.token}`).send({ name: 'Second' });
    const res = await get(accountant.token, `?entityType=user&entityId=${u.id}`);
    expect(res.status).toBe(200);
    expect(res.body.map((e: { after: { name: string } }) => e.after.name)).toEqual(['Second', 'First']);
    expect(res.body[0]).toEqual({
      id: expect.stringMatching(/^\d+$/),
      occurredAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/),
      actorEmail: admin.email,
      action: 'user.update',
      entityType: 'user',
      entityId: u.id,
      before: expect.objectContaining({ name: 'First' }),
      after: expect.objectContaining({ name: 'Second' }),
      reason: null,
      // Its place in the hash chain (the chain itself is checked in server/audit-chain.test.ts).
      chainSeq: expect.stringMatching(/^\d+$/),
      hash: expect.stringMatching(/^[0-9a-f]{64}$/),
      previousHash: expect.stringMatching(/^[0-9a-f]{64}$/),
    });
    expect(Number(res.body[0].chainSeq)).toBeGreaterThan(Number(res.body[1].chainSeq));
    expect((await get(accountant.token, `?entityType=user&entityId=${u.id}&limit=1`)).body).toHaveLength(1);
  });

  it('refuses a limit outside 1–1000 naming it', async () => {
    const res = await get(accountant.token, '?limit=5000');
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('limit');
  });
});
