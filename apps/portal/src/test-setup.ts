import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv();

// The project's `testTimeout` is not applied to tests of a multi-project run; on a busy 2-core
// machine the first test of a file (which compiles its components) can outlast jest's 5 s default.
jest.setTimeout(20_000);
