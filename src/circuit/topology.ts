/**
 * Whole-circuit checks that run when an analysis starts: controlling elements exist and carry a
 * current unknown, something touches ground, every node has a DC path to ground, and no loop is made
 * of voltage-defined branches alone. Each failure names the nodes and elements involved.
 */

import { descriptorOf, ELEMENT_KINDS, KINDS, terminalFields } from '../devices/registry.js';
import { floatingNodes, noGround, unknownElement, voltageLoop } from '../errors/messages.js';
import { type ElementRecord, GROUND, hasCurrentUnknown } from './elements.js';

/** Node names that people use for ground in other conventions. */
const GROUND_LIKE = /^(0|gnd|ground|earth|common|com|vss|agnd|dgnd)$/i;
/** The kinds whose current is an unknown, in words: 'an inductor, a voltage source, a vcvs or a ccvs'. */
const CURRENT_UNKNOWN_KINDS = ((nouns: string[]) => `${nouns.slice(0, -1).join(', ')} or ${nouns.at(-1)}`)(
  ELEMENT_KINDS.filter((k) => KINDS[k].currentUnknown).map((k) => KINDS[k].noun),
);

/** A disjoint-set forest over node indices (union by size, path halving). */
class DisjointSets {
  readonly parent: Int32Array;
  readonly size: Int32Array;
  constructor(n: number) {
    this.parent = new Int32Array(n);
    this.size = new Int32Array(n).fill(1);
    for (let i = 0; i < n; i++) this.parent[i] = i;
  }
  find(i: number): number {
    const p = this.parent;
    while (p[i] !== i) {
      p[i] = p[p[i]!]!;
      i = p[i]!;
    }
    return i;
  }
  /** Join the sets of a and b; false if they were already one. */
  union(a: number, b: number): boolean {
    let ra = this.find(a);
    let rb = this.find(b);
    if (ra === rb) return false;
    if (this.size[ra]! < this.size[rb]!) [ra, rb] = [rb, ra];
    this.parent[rb] = ra;
    this.size[ra]! += this.size[rb]!;
    return true;
  }
}

/** Pairs of nodes joined by a DC-conducting path inside one element. */
function dcConnections(e: ElementRecord): readonly (readonly [string, string])[] {
  return descriptorOf(e).dcPaths(e);
}

/** The branch whose voltage the element imposes (voltage sources, inductors, driven outputs), if any. */
function voltageBranch(e: ElementRecord): readonly [string, string] | undefined {
  return descriptorOf(e).voltageBranch(e);
}

/**
 * Run every whole-circuit check; throws the first failure in the order of docs/building-circuits.md,
 * "Errors". `nodes` numbers every node but ground from 0, as the compile numbers them (its numbering
 * serves both, so the node names are hashed once).
 */
export function checkTopology(elements: readonly ElementRecord[], nodes: ReadonlyMap<string, number>): void {
  // Elements by name, built only if some element names a controlling one.
  let byName: Map<string, ElementRecord> | null = null;
  for (const e of elements) {
    const field = descriptorOf(e).controlField;
    if (field !== null) {
      byName ??= new Map(elements.map((x) => [x.name, x] as const));
      const controlName = (e as unknown as Readonly<Record<string, string>>)[field]!;
      const control = byName.get(controlName);
      if (control === undefined) {
        throw unknownElement(controlName, `the controlling element of '${e.name}' is not in the circuit`, [
          e.name,
          field,
        ]);
      }
      if (!hasCurrentUnknown(control)) {
        throw unknownElement(
          controlName,
          `cannot control '${e.name}': only ${CURRENT_UNKNOWN_KINDS} has a current unknown`,
          [e.name, field],
        );
      }
    }
  }

  let touchesGround = false;
  for (let k = 0; k < elements.length && !touchesGround; k++) {
    const e = elements[k]!;
    const fields = terminalFields(e);
    for (let t = 0; t < fields.length; t++) {
      if ((e as unknown as Readonly<Record<string, string>>)[fields[t]!] === GROUND) touchesGround = true;
    }
  }
  // A node named like a ground ('0', 'GND', 'ground') was most likely meant to be one.
  if (!touchesGround) throw noGround([...nodes.keys()].filter((node) => GROUND_LIKE.test(node)));

  // Ground is set 0 of the forests, node k is set k + 1.
  const at = (node: string): number => (node === GROUND ? 0 : nodes.get(node)! + 1);
  const dc = new DisjointSets(nodes.size + 1);
  for (const e of elements) for (const [a, b] of dcConnections(e)) dc.union(at(a), at(b));
  const groundRoot = dc.find(0);
  const floating: string[] = [];
  for (const [name, k] of nodes) if (dc.find(k + 1) !== groundRoot) floating.push(name);
  if (floating.length > 0) throw floatingNodes(floating);

  const loops = new DisjointSets(nodes.size + 1);
  const through: ElementRecord[] = [];
  for (const e of elements) {
    const branch = voltageBranch(e);
    if (branch === undefined) continue;
    const [a, b] = branch;
    if (!loops.union(at(a), at(b))) {
      throw voltageLoop(...loopThrough(e, branch, through));
    }
    through.push(e);
  }
}

/** The elements and nodes of the loop that `closing` makes with the voltage branches already accepted. */
function loopThrough(
  closing: ElementRecord,
  [from, to]: readonly [string, string],
  accepted: readonly ElementRecord[],
): [string[], string[]] {
  if (from === to) return [[closing.name], [from]];
  // Breadth-first search from `to` back to `from` over accepted voltage branches.
  const adjacency = new Map<string, { next: string; via: string }[]>();
  for (const e of accepted) {
    const [a, b] = voltageBranch(e)!;
    if (!adjacency.has(a)) adjacency.set(a, []);
    if (!adjacency.has(b)) adjacency.set(b, []);
    adjacency.get(a)!.push({ next: b, via: e.name });
    adjacency.get(b)!.push({ next: a, via: e.name });
  }
  const cameFrom = new Map<string, { prev: string; via: string }>();
  const queue = [to];
  const seen = new Set([to]);
  while (queue.length > 0) {
    const node = queue.shift()!;
    if (node === from) break;
    for (const { next, via } of adjacency.get(node) ?? []) {
      if (seen.has(next)) continue;
      seen.add(next);
      cameFrom.set(next, { prev: node, via });
      queue.push(next);
    }
  }
  const elements = [closing.name];
  const nodes = [from];
  let node = from;
  while (node !== to) {
    const step = cameFrom.get(node)!;
    elements.push(step.via);
    node = step.prev;
    nodes.push(node);
  }
  return [elements, nodes];
}
