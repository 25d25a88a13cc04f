import { client, createMeterRun, settled, signIn, until, type Client } from '../support/api';

/**
 * Alarms through the running server: a CSV of recent readings is imported, the history worker
 * recomputes its hours, the alarm evaluator walks the readings at their own times, the notifier
 * mails the engineers through the SMTP stand-in, and the admin's outbox shows the mail.
 * Expected times by hand from the default limits: DP low in range below 10 % of span with a
 * 300 s on-delay and 60 s off-delay; stale after 600 s without a reading; frozen over 30 min.
 */
let engineer: Client;
let operator: Client;
let accountant: Client;
let admin: Client;
beforeAll(async () => {
  [engineer, operator, accountant, admin] = await Promise.all(
    ['engineer', 'operator', 'accountant', 'admin'].map(async (r) => client(await signIn(`${r}@demo.tallyrun`))),
  );
});

const MIN = 60_000;

describe('alarms from imported readings', () => {
  let f: Awaited<ReturnType<typeof createMeterRun>>;
  // Whole minutes from 50 min ago: 10 min at 40 % of span, 20 min at 5 %, then 40 % to a minute ago,
  // with no DP reading for 12 min near the end; the temperature never changes (frozen).
  const t0 = Math.floor((Date.now() - 50 * MIN) / MIN) * MIN;
  const dpAt = (i: number) => (i >= 10 && i < 30 ? 2.5 : 20); // kPa on a 0–50 kPa span
  const dpGap = (i: number) => i >= 36 && i < 48;

  beforeAll(async () => {
    f = await createMeterRun(engineer, { timeZone: 'UTC', contractHour: 0 });
    const lines = ['time,tag,value,quality'];
    for (let i = 0; i < 49; i++) {
      const iso = new Date(t0 + i * MIN).toISOString();
      if (!dpGap(i)) lines.push(`${iso},${f.dp.tag},${dpAt(i) + (i % 2) * 0.003},good`);
      lines.push(`${iso},${f.pt.tag},${2 + (i % 3) * 0.0001},good`, `${iso},${f.tt.tag},300,good`);
    }
    const started = await engineer.upload('/api/imports', 'alarms.csv', lines.join('\n') + '\n');
    expect(started.status).toBe(202);
    await until(
      'the import',
      async () => (await engineer.get(`/api/imports/${started.body.id}`)).body.status === 'done',
    );
    await settled(engineer, f.meterRun.id);
  });

  const alarms = (query = '') => operator.get(`/api/alarms?meterRunId=${f.meterRun.id}${query}`);

  it('raises exactly one low-in-range alarm at onset + on-delay, returned to normal when DP rose', async () => {
    const list = await until('the low-in-range alarm to clear', async () => {
      const r = (await alarms('&condition=dp-low-in-range')).body;
      return r.length && r[0].clearedAt ? r : null;
    });
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({
      transmitterId: f.dp.id,
      priority: 'medium',
      state: 'returned-unacknowledged',
      onsetAt: new Date(t0 + 10 * MIN).toISOString(),
      raisedAt: new Date(t0 + 15 * MIN).toISOString(),
      clearedAt: new Date(t0 + 31 * MIN).toISOString(),
    });
  });

  it('finds the frozen temperature transmitter and the stale DP transmitter', async () => {
    const frozen = await until(
      'a frozen alarm',
      async () =>
        (await alarms('&condition=frozen')).body.filter(
          (a: { transmitterId: string }) => a.transmitterId === f.tt.id,
        )[0],
    );
    // First covered 30-min window: [t0 + 1 min, t0 + 31 min] with the t0 reading in force at its start.
    expect(frozen.raisedAt).toBe(new Date(t0 + 31 * MIN).toISOString());
    // The evaluator walks the readings in rounds; the stale alarm may be stored in a later round than the frozen one.
    const stale = await until('the stale alarm to be raised and cleared', async () => {
      const list = (await alarms('&condition=stale')).body.filter(
        (a: { transmitterId: string }) => a.transmitterId === f.dp.id,
      );
      return list.length && list.every((a: { clearedAt: string | null }) => a.clearedAt) ? list : null;
    });
    // Last DP reading before the gap at t0 + 35 min; stale 600 s later; the next reading at t0 + 48 min clears it.
    expect(stale.map((a: { raisedAt: string; clearedAt: string }) => [a.raisedAt, a.clearedAt])).toEqual([
      [new Date(t0 + 45 * MIN).toISOString(), new Date(t0 + 48 * MIN).toISOString()],
    ]);
  });

  it('mails the engineers: the mail is in the admin outbox', async () => {
    const mail = await until('the alarm mail', async () =>
      (await admin.get('/api/mail')).body.find(
        // The subject says the condition in words (issue 14), as screens do: no code.
        (m: { subject: string }) => m.subject.includes(f.meterRun.tag) && m.subject.includes('DP low in range'),
      ),
    );
    expect(mail.to).toEqual(expect.arrayContaining(['engineer@demo.tallyrun', 'engineer2@demo.tallyrun']));
    expect(mail.text).toMatch(/5\.0 % of its span, below 10 %/);
    expect((await operator.get('/api/mail')).status).toBe(403);
  });

  it('refuses an accountant acknowledging (403), acknowledges for an operator, and answers a second acknowledge with 409', async () => {
    const [low] = (await alarms('&condition=dp-low-in-range')).body;
    const refused = await accountant.post(`/api/alarms/${low.id}/acknowledge`);
    expect(refused.status).toBe(403);
    const ok = await operator.post(`/api/alarms/${low.id}/acknowledge`);
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ state: 'normal', acknowledgedBy: 'operator@demo.tallyrun' });
    const again = await engineer.post(`/api/alarms/${low.id}/acknowledge`);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_normal');
    const events = (await accountant.get(`/api/alarms/${low.id}/events`)).body;
    expect(events.map((e: { action: string }) => e.action)).toEqual(['raised', 'cleared', 'acknowledged']);
  });

  it('refuses limits that make no sense, naming the field', async () => {
    const res = await engineer.post('/api/alarm-limits', {
      meterRunId: f.meterRun.id,
      condition: 'dp-low-in-range',
      thresholdShareOfSpan: 1.5,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('thresholdShareOfSpan');
  });
});
