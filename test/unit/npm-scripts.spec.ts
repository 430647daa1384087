// Every npm script that runs a file of the repository names a file that exists (`npm run typecheck`
// once named a script that did not).
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const root = join(__dirname, '..', '..');
const scripts = (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { scripts: Record<string, string> }).scripts;

describe('package.json scripts', () => {
  const runsAFile = Object.entries(scripts).filter(([, command]) => /^(node|tsx) \S+\.(m?js|ts)\b/.test(command));

  it('include typecheck, test and start', () => {
    expect(Object.keys(scripts)).toEqual(expect.arrayContaining(['typecheck', 'test', 'start']));
  });

  it.each(runsAFile)('"%s" runs a file that exists (%s)', (_name, command) => {
    const file = command.split(' ')[1];
    expect(existsSync(join(root, file))).toBe(true);
  });
});
