// `testTimeout` in a jest project's settings is not applied per project: the API tests set it here.
// Uploads of several megabytes and bcrypt sign-ins on a busy 2-core machine outlast jest's 5 s default.
jest.setTimeout(20_000);
