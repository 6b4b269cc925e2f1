const { createCjsPreset } = require('jest-preset-angular/presets');

/** Angular unit tests: *.spec.ts beside the code under src/. */
module.exports = {
  ...createCjsPreset({
    tsconfig: '<rootDir>/tsconfig.spec.json',
    testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
  }),
  roots: ['<rootDir>/src'],
  // The first test of a page loads its lazy route (three.js and all) through the transformer: seconds on a busy 2-core
  // machine, so jest's 5 s default fails there without anything being wrong.
  testTimeout: 30000,
  setupFilesAfterEnv: ['<rootDir>/src/test-setup.ts'],
  transformIgnorePatterns: ['node_modules/(?!(.*\\.mjs$|three/|three-mesh-bvh/|d3-[a-z-]+/|internmap/|@angular/common/locales/.*\\.js$))'],
};
