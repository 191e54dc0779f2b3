// One Jest run, three projects: the pure domain library, the server (real PostgreSQL) and the
// Angular client (jsdom). See DEVELOPERS.md for how the test command drives them.
const tsJest = ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json', isolatedModules: true }];
module.exports = {
  // Jest reads testTimeout from the top level only (a project's own setting is ignored): real
  // signing, PDF work and browsers on a busy 2-core machine need more than the default 5 s.
  testTimeout: 60_000,
  projects: [
    {
      displayName: 'shared',
      rootDir: __dirname,
      testEnvironment: 'node',
      testMatch: ['<rootDir>/shared/**/*.spec.ts', '<rootDir>/templates/**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
    },
    {
      displayName: 'server',
      rootDir: __dirname,
      // Signing and PDF work run for real; a busy 2-core machine needs more than Jest's 5 s.
      testTimeout: 30_000,
      testEnvironment: 'node',
      testMatch: ['<rootDir>/server/**/*.spec.ts', '<rootDir>/fakes/**/*.spec.ts'],
      transform: { '^.+\\.ts$': tsJest },
      setupFiles: ['<rootDir>/test/support/env.ts'],
    },
    {
      displayName: 'client',
      rootDir: __dirname,
      testMatch: ['<rootDir>/src/**/*.spec.ts'],
      ...require('jest-preset-angular/presets').createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json' }),
      testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
      setupFilesAfterEnv: ['<rootDir>/src/test-setup.ts'],
    },
    {
      displayName: 'e2e',
      rootDir: __dirname,
      testTimeout: 60_000,
      testEnvironment: 'node',
      testMatch: ['<rootDir>/test/e2e/**/*.test.ts', '<rootDir>/test/security/**/*.test.ts', '<rootDir>/test/faults/**/*.test.ts'],
      transform: { '^.+\\.ts$': tsJest },
      setupFiles: ['<rootDir>/test/support/env.ts'],
    },
  ],
};
