// One jest configuration, four projects. scripts/test.mjs runs them in this order:
// unit (pure shared code, server units, corpus), portal (Angular components),
// api (supertest against a real PostgreSQL), browser (playwright-core + Debian chromium).
const swc = ['@swc/jest', { jsc: { parser: { syntax: 'typescript' }, target: 'es2022' }, module: { type: 'commonjs' } }];
const sharedAlias = { '^@cc/shared$': '<rootDir>/shared/src/index.ts', '^@cc/shared/(.*)$': '<rootDir>/shared/src/$1' };
// file-type (photo sniffing) and its helpers ship only ES modules, and file-type exports no `require`
// entry: jest loads its ESM entry and compiles these packages to CommonJS like the project's own code.
const esmOnly = ['file-type', 'strtok3', 'token-types', '@tokenizer', '@borewit', 'uint8array-extras'];

// Generous time limits: the suite shares a 2-core machine with other work (uploads of several
// megabytes, bcrypt sign-ins, the first compile of a component file), and a test or hook must not fail
// for being slow (speed is measured in bench/).
const LOADED_MACHINE_TIMEOUT_MS = 60_000;

const node = {
  testEnvironment: 'node',
  transform: { '^.+\\.(t|j)s$': swc },
  transformIgnorePatterns: [`/node_modules/(?!(${esmOnly.join('|')})/)`],
  moduleNameMapper: { ...sharedAlias, '^file-type$': '<rootDir>/node_modules/file-type/index.js' },
  rootDir: __dirname,
};

module.exports = {
  // A global option: jest does not read testTimeout from a project's own settings.
  testTimeout: LOADED_MACHINE_TIMEOUT_MS,
  projects: [
    {
      ...node,
      displayName: 'unit',
      testMatch: [
        '<rootDir>/shared/src/**/*.spec.ts',
        '<rootDir>/server/src/**/*.spec.ts',
        '<rootDir>/test/unit/**/*.spec.ts',
      ],
      testEnvironment: '<rootDir>/test/helpers/pdf-environment.js',
    },
    {
      displayName: 'portal',
      rootDir: __dirname,
      preset: 'jest-preset-angular',
      testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
      setupFilesAfterEnv: ['<rootDir>/apps/portal/src/test-setup.ts'],
      testMatch: ['<rootDir>/apps/portal/src/**/*.spec.ts'],
      moduleNameMapper: sharedAlias,
      transform: {
        '^.+\\.(ts|js|mjs|html|svg)$': [
          'jest-preset-angular',
          { tsconfig: '<rootDir>/apps/portal/tsconfig.spec.json', stringifyContentPathRegex: '\\.(html|svg)$' },
        ],
      },
      transformIgnorePatterns: ['node_modules/(?!.*\\.mjs$)'],
    },
    {
      ...node,
      displayName: 'api',
      testMatch: ['<rootDir>/test/api/**/*.api.spec.ts'],
      setupFilesAfterEnv: ['<rootDir>/test/helpers/api-setup.ts'],
      testEnvironment: '<rootDir>/test/helpers/pdf-environment.js',
      globalSetup: '<rootDir>/test/helpers/api-global-setup.ts',
    },
    {
      ...node,
      displayName: 'browser',
      testMatch: ['<rootDir>/test/browser/**/*.browser.spec.ts'],
      globalSetup: '<rootDir>/test/helpers/browser-global-setup.ts',
      globalTeardown: '<rootDir>/test/helpers/browser-global-teardown.ts',
    },
  ],
};
