/**
 * Compiling a circuit into equations: number the unknowns (circuit nodes, then internal nodes, then
 * branch currents), let every device take its matrix slots, and build the one sparse pattern that
 * every Newton iteration and every frequency reuses.
 */
import { type ElementRecord, GROUND, terminalsOf } from '../circuit/elements.js';
import { checkTopology } from '../circuit/topology.js';
import type { AllocationContext, BindContext, Device } from '../devices/device.js';
import { createDevice } from '../devices/registry.js';
import { unknownElement } from '../errors/messages.js';
import { type CscPattern, compressPattern } from '../linalg/index.js';

/** What an unknown stands for, for messages and result lookups. */
export interface UnknownLabel {
  readonly kind: 'node' | 'branch';
  /** The node name (internal nodes are `element#label`) or the element owning the branch current. */
  readonly name: string;
}

/** A circuit compiled into modified nodal equations on a fixed sparse pattern. */
export interface CompiledSystem {
  /** Number of unknowns. Index n is the ground/trash index of every vector. */
  readonly n: number;
  /** Number of node-voltage unknowns (circuit and internal nodes): rows 0 … nodeCount−1. */
  readonly nodeCount: number;
  readonly labels: readonly UnknownLabel[];
  /** Circuit node name → unknown index (ground → n). */
  readonly nodeIndex: ReadonlyMap<string, number>;
  readonly devices: readonly Device[];
  readonly deviceByName: ReadonlyMap<string, Device>;
  /** Branch-current unknown of each element that has one. */
  readonly branchIndex: ReadonlyMap<string, number>;
  readonly pattern: CscPattern;
  /** Number of stored entries; matrix value arrays have nnz+1 entries (the last is the trash slot). */
  readonly nnz: number;
  /** Diagonal slot of every node row, for the conductance added to ground while stepping. */
  readonly nodeDiagonal: Int32Array;
  /** Whether any device is nonlinear. */
  readonly nonlinear: boolean;
  /** Names of the elements touching each unknown (for messages about singular rows). */
  readonly elementsAt: readonly (readonly string[])[];
  readonly records: readonly ElementRecord[];
}

/** Check and compile element records. Throws the topology errors of the contract. */
export function compileCircuit(records: readonly ElementRecord[]): CompiledSystem {
  checkTopology(records);
  const devices = records.map(createDevice);
  const labels: UnknownLabel[] = [];
  const nodeIndex = new Map<string, number>();
  for (const record of records) {
    for (const [, node] of terminalsOf(record)) {
      if (node !== GROUND && !nodeIndex.has(node)) {
        nodeIndex.set(node, labels.length);
        labels.push({ kind: 'node', name: node });
      }
    }
  }
  const branchIndex = new Map<string, number>();
  let branchesOpen = false;
  const allocation: AllocationContext = {
    node: (name) => nodeIndex.get(name) ?? -1,
    internalNode(owner, label) {
      if (branchesOpen) throw new Error('internal nodes must be allocated before branches');
      labels.push({ kind: 'node', name: `${owner}#${label}` });
      return labels.length - 1;
    },
    branch(owner) {
      labels.push({ kind: 'branch', name: owner });
      if (!branchIndex.has(owner)) branchIndex.set(owner, labels.length - 1);
      return labels.length - 1;
    },
  };
  for (const d of devices) d.allocateNodes?.(allocation);
  const nodeCount = labels.length;
  branchesOpen = true;
  for (const d of devices) d.allocateBranches?.(allocation);
  const n = labels.length;
  nodeIndex.set(GROUND, n);

  const rows: number[] = [];
  const cols: number[] = [];
  const requests: { target: Int32Array; first: number }[] = [];
  const bind: BindContext = {
    node(name) {
      const k = nodeIndex.get(name);
      if (k === undefined) throw new Error(`node '${name}' was not numbered`);
      return k;
    },
    branchOf(name) {
      const k = branchIndex.get(name);
      if (k === undefined) throw unknownElement(name, 'it has no current unknown');
      return k;
    },
    slots(pairs) {
      const target = new Int32Array(pairs.length / 2);
      requests.push({ target, first: rows.length });
      for (let t = 0; t < pairs.length; t += 2) {
        rows.push(pairs[t]!);
        cols.push(pairs[t + 1]!);
      }
      return target;
    },
  };
  for (const d of devices) d.bind(bind);
  const diagonalRequest = bind.slots(Array.from({ length: nodeCount * 2 }, (_, i) => i >> 1));

  // Ground rows and columns go to the trash slot nnz; the rest are compressed.
  const kept: number[] = [];
  for (let t = 0; t < rows.length; t++) if (rows[t]! < n && cols[t]! < n) kept.push(t);
  const { pattern, slots } = compressPattern(
    n,
    kept.map((t) => rows[t]!),
    kept.map((t) => cols[t]!),
  );
  const nnz = pattern.Ai.length;
  const slotOfTriplet = new Int32Array(rows.length).fill(nnz);
  kept.forEach((t, k) => {
    slotOfTriplet[t] = slots[k]!;
  });
  for (const { target, first } of requests) {
    for (let k = 0; k < target.length; k++) target[k] = slotOfTriplet[first + k]!;
  }

  const elementsAt: string[][] = labels.map(() => []);
  for (const record of records) {
    for (const [, node] of terminalsOf(record)) {
      const k = nodeIndex.get(node)!;
      // A record's terminals come together, so a repeat is always the last name pushed (no search:
      // a supply node touches thousands of elements).
      const names = elementsAt[k];
      if (k < n && names![names!.length - 1] !== record.name) names!.push(record.name);
    }
    const k = branchIndex.get(record.name);
    if (k !== undefined) elementsAt[k]!.push(record.name);
  }
  labels.forEach((label, k) => {
    if (label.kind === 'node' && label.name.includes('#')) elementsAt[k]!.push(label.name.split('#')[0]!);
  });

  return {
    n,
    nodeCount,
    labels,
    nodeIndex,
    devices,
    deviceByName: new Map(devices.map((d) => [d.name, d])),
    branchIndex,
    pattern,
    nnz,
    nodeDiagonal: diagonalRequest,
    nonlinear: devices.some((d) => d.nonlinear),
    elementsAt,
    records,
  };
}
