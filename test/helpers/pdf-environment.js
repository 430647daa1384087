// Node test environment that makes pdf.js (used by pdf-parse) find its worker inside jest's sandbox.
const NodeEnvironment = require('jest-environment-node').TestEnvironment;

class PdfEnvironment extends NodeEnvironment {
  async setup() {
    await super.setup();
    this.global.pdfjsWorker = await import('pdfjs-dist/legacy/build/pdf.worker.mjs');
  }
}

module.exports = PdfEnvironment;
