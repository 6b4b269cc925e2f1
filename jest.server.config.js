/** Server, engine, ingest and CLI tests: *.spec.ts beside the code under server/, plus test/integration and the model generator's own specs. */
module.exports = {
  testEnvironment: 'node',
  roots: ['<rootDir>/server', '<rootDir>/test'],
  testMatch: ['<rootDir>/server/**/*.spec.ts', '<rootDir>/test/integration/**/*.spec.ts', '<rootDir>/test/generator/**/*.spec.ts'],
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.server.json' }],
    '^.+\\.m?js$': ['ts-jest', { tsconfig: { allowJs: true, module: 'commonjs' } }],
  },
  transformIgnorePatterns: ['/node_modules/(?!(property-graph)/)'],
  testTimeout: 30000,
};
