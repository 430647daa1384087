// The pages the parser reads for every corpus excerpt, rendered once (PDF layout and extraction
// take most of a corpus run) and kept in a cache file, so that the veto trial can parse the corpus
// many times, with today's parser or an older one, without laying out the PDFs again.
import { existsSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { CORPUS_LAYOUT } from '../corpus-runner';
import { renderPages, RENDERS, type Render } from '../render';

export const PAGES_CACHE = join(__dirname, '..', '..', '..', 'node_modules', '.cache', 'veto', 'pages.json');

export interface CachedExcerpt {
  readonly file: string;
  readonly render: Render;
  readonly pages: string[];
}

/** Every corpus excerpt's pages, rendered as its manifest says; read from the cache when it is there and up to date. */
export async function corpusPages(): Promise<CachedExcerpt[]> {
  const manifest = JSON.parse(readFileSync(CORPUS_LAYOUT.manifestFile, 'utf8')) as Record<string, { render?: string }>;
  const files = readdirSync(CORPUS_LAYOUT.excerptDir).filter((f) => f.endsWith('.txt')).sort();
  const key = (file: string, text: string) => `${file}:${manifest[file]?.render ?? 'text'}:${text.length}:${hash(text)}`;
  const cached: Record<string, CachedExcerpt & { key: string }> = existsSync(PAGES_CACHE) ? JSON.parse(readFileSync(PAGES_CACHE, 'utf8')) : {};
  const out: CachedExcerpt[] = [];
  let changed = false;
  for (const file of files) {
    const text = readFileSync(join(CORPUS_LAYOUT.excerptDir, file), 'utf8');
    const k = key(file, text);
    if (cached[file]?.key !== k) {
      const render = (manifest[file]?.render ?? 'text') as Render;
      if (!(RENDERS as readonly string[]).includes(render)) throw new Error(`${file}: unknown render ${render}`);
      cached[file] = { key: k, file, render, pages: await renderPages(text, render) };
      changed = true;
    }
    const { render, pages } = cached[file];
    out.push({ file, render, pages });
  }
  if (changed) {
    mkdirSync(dirname(PAGES_CACHE), { recursive: true });
    writeFileSync(PAGES_CACHE, JSON.stringify(cached));
  }
  return out;
}

function hash(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619) >>> 0;
  return h;
}

if (require.main === module) {
  void corpusPages().then((x) => console.log(`${x.length} excerpts cached in ${PAGES_CACHE}`));
}
