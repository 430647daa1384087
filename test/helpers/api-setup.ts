// Reports are read in worker threads that start on first use, which takes seconds on a busy
// machine: an API test may wait that long for its first upload.
jest.setTimeout(30_000);
