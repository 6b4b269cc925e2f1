const { createCjsPreset } = require('jest-preset-angular/presets');

/** Angular unit tests: *.spec.ts beside the code under src/. */
module.exports = {
  ...createCjsPreset({
    tsconfig: '<rootDir>/tsconfig.spec.json',
    testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
  }),
  roots: ['<rootDir>/src'],
  setupFilesAfterEnv: ['<rootDir>/src/test-setup.ts'],
  transformIgnorePatterns: ['node_modules/(?!(.*\\.mjs$|three/|three-mesh-bvh/|d3-[a-z-]+/|internmap/|@angular/common/locales/.*\\.js$))'],
};
