/**
 * The relative links of README.md and docs/*.md lead to files that exist and that the package ships,
 * so that they work in the repository, in an installed package (node_modules/quiescent) and on the
 * file views of package registries alike (docs/getting-started.md, "Installation").
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = resolve(fileURLToPath(import.meta.url), '../../..');
const packageFiles: readonly string[] = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')).files;

/** Whether `path` (relative to the root) is matched by an entry of package.json `files`. */
function shipped(path: string): boolean {
  if (['LICENSE', 'package.json'].includes(path)) return true; // npm always ships these
  return packageFiles.some((entry) => {
    if (!entry.includes('*')) return path === entry || path.startsWith(`${entry}/`);
    const pattern = new RegExp(`^${entry.replace(/\./g, '\\.').replace(/\*/g, '[^/]*')}$`);
    return pattern.test(path);
  });
}

/** Link targets of a Markdown text that are neither web addresses nor anchors in the same page. */
function relativeLinks(markdown: string): string[] {
  const withoutCode = markdown.replace(/^```[\s\S]*?^```\s*$/gm, '');
  const targets: string[] = [];
  for (const m of withoutCode.matchAll(/\]\(([^)\s]+)\)/g)) {
    const target = m[1]!;
    if (/^[a-z]+:/i.test(target) || target.startsWith('#')) continue;
    targets.push(target.replace(/#.*$/, ''));
  }
  return targets;
}

const pages = [
  'README.md',
  ...readdirSync(join(root, 'docs'))
    .filter((f) => f.endsWith('.md'))
    .map((f) => `docs/${f}`),
];

describe('the links of the documentation', () => {
  it('ship every page that links elsewhere', () => {
    for (const page of pages) expect(shipped(page), page).toBe(true);
  });

  for (const page of pages) {
    it(`lead from ${page} to files that exist and are shipped`, () => {
      for (const target of relativeLinks(readFileSync(join(root, page), 'utf8'))) {
        const path = relative(root, resolve(dirname(join(root, page)), target));
        expect(existsSync(join(root, path)), `${page} → ${target}`).toBe(true);
        expect(shipped(path), `${page} → ${target} is not in package.json "files"`).toBe(true);
      }
    });
  }
});
