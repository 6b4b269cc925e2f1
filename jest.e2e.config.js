/** Browser end-to-end tests: the built app served by the real server, driven by playwright-core in chromium. */
module.exports = {
  testEnvironment: 'node',
  roots: ['<rootDir>/test/e2e'],
  testMatch: ['<rootDir>/test/e2e/**/*.e2e.ts'],
  transform: { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.server.json' }] },
  maxWorkers: 1,
  testTimeout: 120000,
};
