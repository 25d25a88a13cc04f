import { readEnv } from './env';

const base: NodeJS.ProcessEnv = { NODE_ENV: 'test', DATABASE_URL: 'postgres://example/tallyrun' };

describe('TALLYRUN_TRUST_PROXY', () => {
  it('trusts no proxy when unset or blank, so X-Forwarded-For is ignored', () => {
    expect(readEnv(base).TALLYRUN_TRUST_PROXY).toBe(false);
    expect(readEnv({ ...base, TALLYRUN_TRUST_PROXY: ' ' }).TALLYRUN_TRUST_PROXY).toBe(false);
  });

  it('passes a hop count or a list of addresses, subnets and names to Express', () => {
    expect(readEnv({ ...base, TALLYRUN_TRUST_PROXY: '1' }).TALLYRUN_TRUST_PROXY).toBe(1);
    expect(readEnv({ ...base, TALLYRUN_TRUST_PROXY: 'loopback, 10.0.0.0/8, ::1' }).TALLYRUN_TRUST_PROXY).toBe(
      'loopback,10.0.0.0/8,::1',
    );
  });

  it('refuses an entry that is not an address, subnet or known name, naming the setting and the entry', () => {
    expect(() => readEnv({ ...base, TALLYRUN_TRUST_PROXY: 'loopback, proxy.local' })).toThrow(
      /TALLYRUN_TRUST_PROXY: "proxy\.local" is not/,
    );
    expect(() => readEnv({ ...base, TALLYRUN_TRUST_PROXY: '10.0.0.0/33' })).toThrow(/TALLYRUN_TRUST_PROXY/);
  });
});
