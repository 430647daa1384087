import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv();
// The project's `testTimeout` in jest.config.js is not applied per project; the first test of a file
// compiles its components, which on a busy 2-core machine alone can take seconds.
jest.setTimeout(20_000);
