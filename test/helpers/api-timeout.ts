// Uploads of several megabytes and bcrypt sign-ins on a busy 2-core machine outlast jest's 5 s default
// (the project's `testTimeout` in jest.config.js is not applied per project).
jest.setTimeout(20_000);
