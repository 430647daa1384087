import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv();

// `testTimeout` in a jest project's settings is not applied per project: set it here. The first test of a
// file compiles its components, which on a busy 2-core machine alone takes seconds.
jest.setTimeout(20_000);
