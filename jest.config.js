// Jest projects. `npm test` (server/cli/launch.js) starts PostgreSQL first and passes
// DATABASE_URL, so the server project runs against a real database.
const tsJest = ['ts-jest', { diagnostics: false }];
const base = {
  testEnvironment: 'node',
  transform: { '^.+\\.tsx?$': tsJest },
  moduleFileExtensions: ['ts', 'tsx', 'js', 'json'],
  moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
  setupFiles: ['<rootDir>/tests/support/fast-check-seed.ts'],
};
module.exports = {
  // Tests that go through the broker, the history worker or a browser wait on real work.
  testTimeout: 60_000,
  projects: [
    { ...base, displayName: 'shared', testMatch: ['<rootDir>/shared/**/*.test.ts'] },
    // The client's pure modules (parsing, unit display, tables): plain Node, no DOM, no database.
    {
      ...base,
      displayName: 'client',
      testMatch: [
        '<rootDir>/components/**/*.test.ts',
        '<rootDir>/hooks/**/*.test.ts',
        '<rootDir>/constants/**/*.test.ts',
      ],
    },
    {
      ...base,
      displayName: 'server',
      testMatch: [
        '<rootDir>/server/**/*.test.ts',
        '<rootDir>/simulators/**/*.test.ts',
        '<rootDir>/tests/api/**/*.test.ts',
        '<rootDir>/tests/mqtt/**/*.test.ts',
      ],
    },
    { ...base, displayName: 'browser', testMatch: ['<rootDir>/tests/browser/**/*.test.ts'] },
  ],
};
