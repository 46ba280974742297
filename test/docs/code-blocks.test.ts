/**
 * Every ```ts block of README.md and docs/*.md runs, so that the documentation never drifts from the
 * library. A block marked ```ts no-run is skipped (a signature sketch, a declaration for the reader's
 * own project). Each block is a module of its own: `from 'quiescent'` is pointed at the sources, the
 * block is written to a temporary file and imported. Blocks check their own numbers by throwing.
 */
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it, vi } from 'vitest';

const root = resolve(fileURLToPath(import.meta.url), '../../..');
const entries: Readonly<Record<string, string>> = {
  quiescent: join(root, 'src/index.ts'),
  'quiescent/testing': join(root, 'src/testing/index.ts'),
};

/** A fenced block: where it starts, its info string and its code. */
interface CodeBlock {
  readonly line: number;
  readonly info: string;
  readonly code: string;
}

/** The ```ts (or ```typescript) blocks of a Markdown text, with the line each starts on. */
function typescriptBlocks(markdown: string): CodeBlock[] {
  const blocks: CodeBlock[] = [];
  const fence = /^```(ts|typescript)([^\n]*)\n([\s\S]*?)^```\s*$/gm;
  for (let m = fence.exec(markdown); m !== null; m = fence.exec(markdown)) {
    const line = markdown.slice(0, m.index).split('\n').length;
    blocks.push({ line, info: (m[2] ?? '').trim(), code: m[3] ?? '' });
  }
  return blocks;
}

/** The block with its package imports pointed at the sources. */
function pointAtSources(code: string): string {
  return code.replace(/from\s+'(quiescent(?:\/testing)?)'/g, (whole, name: string) => {
    const target = entries[name];
    return target === undefined ? whole : `from ${JSON.stringify(pathToFileURL(target).href)}`;
  });
}

const documents = [
  'README.md',
  ...readdirSync(join(root, 'docs'))
    .filter((f) => f.endsWith('.md'))
    .map((f) => `docs/${f}`),
];
const scratch = mkdtempSync(join(tmpdir(), 'quiescent-doc-blocks-'));
const silence = vi.spyOn(console, 'log').mockImplementation(() => {});
afterAll(() => silence.mockRestore());

describe('the extraction of code blocks', () => {
  it('finds ts blocks with their info string and line, and nothing else', () => {
    const markdown = 'text\n```ts\nconst a = 1;\n```\n```sh\nls\n```\n```ts no-run\nsketch();\n```\n';
    expect(typescriptBlocks(markdown)).toEqual([
      { line: 2, info: '', code: 'const a = 1;\n' },
      { line: 8, info: 'no-run', code: 'sketch();\n' },
    ]);
  });
});

for (const document of documents) {
  // Blocks marked no-run are sketches for the reader, not programs: they are left out, not skipped.
  const blocks = typescriptBlocks(readFileSync(join(root, document), 'utf8')).filter(
    (block) => !block.info.split(/\s+/).includes('no-run'),
  );
  if (blocks.length === 0) continue;
  describe(document, () => {
    blocks.forEach((block, index) => {
      it(`runs the block at line ${block.line}`, async () => {
        const file = join(scratch, `${document.replace(/[/.]/g, '-')}-${index}.ts`);
        writeFileSync(file, pointAtSources(block.code));
        await import(/* @vite-ignore */ pathToFileURL(file).href);
      });
    });
  });
}
