/**
 * Build-time configuration of the web client. Every setting is read here and nowhere else.
 *
 * Expo inlines `EXPO_PUBLIC_*` variables into the bundle when `expo export` or `expo start`
 * runs, so they are public: never put a secret in one.
 *
 * | variable              | default | meaning                                                    |
 * |-----------------------|---------|------------------------------------------------------------|
 * | `EXPO_PUBLIC_API_URL` | `/api`  | base URL of the Tallyrun API, including its `/api` path,    |
 * |                       |         | e.g. `http://192.168.1.20:8080/api` when the client is served|
 * |                       |         | from another origin (the dev server on :8081). The default  |
 * |                       |         | is the same origin as the page, as when Express serves dist/.|
 */

// Written out in full (not process.env[name]) so Expo's bundler can inline it.
const configuredApiUrl = process.env.EXPO_PUBLIC_API_URL;

export const config = {
  /** Base URL for API requests, without a trailing slash. */
  apiBaseUrl: (configuredApiUrl && configuredApiUrl.trim() ? configuredApiUrl.trim() : '/api').replace(/\/+$/, ''),
  /** How long fetched data counts as fresh before a screen refetches it, in milliseconds. */
  staleTimeMs: 30_000,
} as const;
