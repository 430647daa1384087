// Entry file of a report worker thread. Worker threads start without the TypeScript loader the
// server (tsx) or the tests (jest) run with, so this plain file registers tsx and loads the worker.
// The compiled server (`npm start`, scripts/lib/server-build.mjs) has its own, dist/server/report-worker.cjs.
require('tsx/cjs/api').register();
const worker = require('./report-worker.ts');
module.exports = worker.default ?? worker;
