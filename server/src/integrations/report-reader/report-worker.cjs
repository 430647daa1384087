// Entry file of a report worker thread. Worker threads start without the TypeScript loader the
// server (tsx) or the tests (jest) run with, so this plain file registers tsx and loads the worker.
require('tsx/cjs/api').register();
const worker = require('./report-worker.ts');
module.exports = worker.default ?? worker;
