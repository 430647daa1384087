import { dirname, join } from 'node:path';

// Source Sans 3, the portal's typeface, from the `source-sans` package: pdfkit embeds TrueType/OpenType,
// not woff2, and subsets what a document uses.
const FONT_DIR = join(dirname(require.resolve('source-sans/package.json')), 'TTF');
export const PDF_FONT_REGULAR = join(FONT_DIR, 'SourceSans3-Regular.ttf');
export const PDF_FONT_SEMIBOLD = join(FONT_DIR, 'SourceSans3-Semibold.ttf');
