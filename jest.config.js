// One Jest run, several projects: each suite can also run alone with --selectProjects.
const serverTransform = {
  '^.+\\.ts$': [
    'ts-jest',
    { tsconfig: '<rootDir>/tsconfig.server.json', diagnostics: { warnOnly: false } },
  ],
};
// ESM-only packages that server code reaches through CommonJS dependencies (see the shim).
const serverModules = { '^node-fetch$': '<rootDir>/tests/support/node-fetch-cjs.js' };

/** @type {import('jest').Config} */
module.exports = {
  projects: [
    {
      displayName: 'server',
      testEnvironment: 'node',
      roots: ['<rootDir>/server/src'],
      testMatch: ['**/*.spec.ts'],
      transform: serverTransform,
      moduleNameMapper: serverModules,
      setupFilesAfterEnv: ['<rootDir>/tests/support/test-timeout.ts'],
    },
    {
      displayName: 'reference',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/reference'],
      testMatch: ['**/*.test.ts'],
      transform: serverTransform,
      moduleNameMapper: serverModules,
      setupFilesAfterEnv: ['<rootDir>/tests/support/test-timeout.ts'],
    },
    {
      displayName: 'api',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/api'],
      testMatch: ['**/*.test.ts'],
      transform: serverTransform,
      moduleNameMapper: serverModules,
      setupFilesAfterEnv: ['<rootDir>/tests/support/test-timeout.ts'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      testMatch: ['**/*.test.ts'],
      transform: serverTransform,
      moduleNameMapper: serverModules,
      // A project-level `testTimeout` is ignored by Jest; the setup file sets it.
      setupFilesAfterEnv: ['<rootDir>/tests/support/e2e-timeout.ts'],
    },
    {
      displayName: 'client',
      preset: 'jest-preset-angular',
      testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
      roots: ['<rootDir>/client/src'],
      testMatch: ['**/*.spec.ts'],
      setupFilesAfterEnv: ['<rootDir>/client/src/test-setup.ts'],
      transform: {
        '^.+\\.(ts|js|mjs|html|svg)$': [
          'jest-preset-angular',
          {
            tsconfig: '<rootDir>/client/tsconfig.spec.json',
            stringifyContentPathRegex: '\\.(html|svg)$',
          },
        ],
      },
      transformIgnorePatterns: ['node_modules/(?!.*\\.mjs$)'],
    },
  ],
};
