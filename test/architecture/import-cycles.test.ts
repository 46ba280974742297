/**
 * Data flows one way between the folders of src/ (README.md, "Architecture"): this reads every
 * import of every source file, draws the graph of folders, and fails on a cycle, naming it.
 * Common practice, no source: a depth-first search that reports a back edge.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const SRC = resolve(__dirname, '../../src');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((entry) => {
    const path = join(dir, entry);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return path.endsWith('.ts') ? [path] : [];
  });
}

/** The top folder of src/ a file belongs to ('.' for src/index.ts). */
function folderOf(file: string): string {
  const parts = relative(SRC, file).split('/');
  return parts.length === 1 ? '.' : parts[0]!;
}

/** Edges between top folders, each with one import that makes it. */
function folderGraph(): Map<string, Map<string, string>> {
  const graph = new Map<string, Map<string, string>>();
  for (const file of sourceFiles(SRC)) {
    const from = folderOf(file);
    const text = readFileSync(file, 'utf8');
    for (const match of text.matchAll(/(?:from|import)\s*\(?\s*'(\.[^']+)'/g)) {
      const target = resolve(dirname(file), match[1]!);
      const to = folderOf(target);
      if (to === from) continue;
      if (!graph.has(from)) graph.set(from, new Map());
      if (!graph.get(from)!.has(to)) graph.get(from)!.set(to, `${relative(SRC, file)} imports ${match[1]}`);
    }
  }
  return graph;
}

/** One cycle of the graph as the imports that make it, or undefined when there is none. */
function findCycle(graph: Map<string, Map<string, string>>): string[] | undefined {
  const state = new Map<string, 'open' | 'done'>();
  const stack: string[] = [];
  const visit = (node: string): string[] | undefined => {
    state.set(node, 'open');
    stack.push(node);
    for (const next of graph.get(node)?.keys() ?? []) {
      if (state.get(next) === 'open') {
        const loop = [...stack.slice(stack.indexOf(next)), next];
        return loop.slice(1).map((to, i) => graph.get(loop[i]!)!.get(to)!);
      }
      if (state.get(next) === undefined) {
        const found = visit(next);
        if (found) return found;
      }
    }
    stack.pop();
    state.set(node, 'done');
    return undefined;
  };
  for (const node of graph.keys()) {
    if (state.get(node) === undefined) {
      const found = visit(node);
      if (found) return found;
    }
  }
  return undefined;
}

describe('the folders of src/', () => {
  it('import one another without a cycle', () => {
    expect(findCycle(folderGraph())).toBeUndefined();
  });

  it('finds a cycle when there is one (the check itself can fail)', () => {
    const graph = new Map([
      ['a', new Map([['b', 'a/x.ts imports ../b/y.js']])],
      ['b', new Map([['a', 'b/y.ts imports ../a/x.js']])],
    ]);
    expect(findCycle(graph)).toEqual(['a/x.ts imports ../b/y.js', 'b/y.ts imports ../a/x.js']);
  });

  it('keeps errors/ at the bottom and report/ above analysis/', () => {
    const graph = folderGraph();
    expect([...(graph.get('errors')?.keys() ?? [])]).toEqual([]);
    expect(graph.get('analysis')?.has('report') ?? false).toBe(false);
  });
});
