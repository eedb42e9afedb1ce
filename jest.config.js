// One Jest 29 run, three projects:
//   server: API tests (supertest + the real PostgreSQL test database), node env, @swc/jest
//   shared: pure computations and the lifecycle, node env, @swc/jest
//   web:    components under jest-expo/web (jsdom + react-native-web) with @testing-library/react
const esmOnly = ['jose', 'file-type', 'strtok3', 'token-types', '@tokenizer', 'uint8array-extras', '@borewit'];
const swc = [
  '@swc/jest',
  {
    jsc: { parser: { syntax: 'typescript', tsx: true }, target: 'es2022' },
    module: { type: 'commonjs' },
  },
];
const nodeProject = (name, roots) => ({
  displayName: name,
  testEnvironment: 'node',
  roots,
  testMatch: ['**/*.test.ts'],
  transform: { '^.+\\.[tj]sx?$': swc },
  transformIgnorePatterns: [`/node_modules/(?!(${esmOnly.join('|')})/)`],
  moduleNameMapper: {
    '^file-type$': '<rootDir>/node_modules/file-type/index.js',
    '^@shared/(.*)$': '<rootDir>/shared/$1',
  },
});

/** @type {import('jest').Config} */
module.exports = {
  cacheDirectory: '<rootDir>/.cache/jest',
  testTimeout: 30000,
  projects: [
    {
      ...nodeProject('server', ['<rootDir>/tests/server']),
      globalSetup: '<rootDir>/tests/server/global-setup.ts',
    },
    nodeProject('shared', ['<rootDir>/tests/shared']),
    {
      displayName: 'web',
      preset: 'jest-expo/web',
      roots: ['<rootDir>/tests/web'],
      testMatch: ['**/*.test.ts?(x)'],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/src/$1', '^@shared/(.*)$': '<rootDir>/shared/$1' },
    },
  ],
};
