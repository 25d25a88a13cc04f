/** The API base URL, read from EXPO_PUBLIC_API_URL when the module is first imported. */
import type * as configModule from './config';

type ConfigModule = typeof configModule;

function configWith(apiUrl: string | undefined): ConfigModule['config'] {
  const original = process.env.EXPO_PUBLIC_API_URL;
  if (apiUrl === undefined) delete process.env.EXPO_PUBLIC_API_URL;
  else process.env.EXPO_PUBLIC_API_URL = apiUrl;
  let loaded: ConfigModule | undefined;
  try {
    jest.isolateModules(() => {
      loaded = jest.requireActual<ConfigModule>('./config');
    });
  } finally {
    if (original === undefined) delete process.env.EXPO_PUBLIC_API_URL;
    else process.env.EXPO_PUBLIC_API_URL = original;
  }
  return loaded!.config;
}

describe('config.apiBaseUrl', () => {
  it('is the same origin’s /api when EXPO_PUBLIC_API_URL is not set', () => {
    expect(configWith(undefined).apiBaseUrl).toBe('/api');
  });

  it('is the same origin’s /api when EXPO_PUBLIC_API_URL is blank', () => {
    expect(configWith('   ').apiBaseUrl).toBe('/api');
  });

  it('takes the configured URL without blanks or trailing slashes', () => {
    expect(configWith(' http://192.168.1.20:8080/api// ').apiBaseUrl).toBe('http://192.168.1.20:8080/api');
  });
});

describe('config.staleTimeMs', () => {
  it('keeps fetched data fresh for 30 seconds', () => {
    expect(configWith(undefined).staleTimeMs).toBe(30_000);
  });
});
