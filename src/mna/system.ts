/**
 * Compiling a circuit into equations: number the unknowns (circuit nodes, then internal nodes, then
 * branch currents), let every device take its matrix slots, and build the one sparse pattern that
 * every Newton iteration and every frequency reuses.
 */
import { type ElementRecord, GROUND, terminalsOf } from '../circuit/elements.js';
import { checkTopology } from '../circuit/topology.js';
import type { AllocationContext, BindContext, Device } from '../devices/device.js';
import { createDevice, terminalFields } from '../devices/registry.js';
import { unknownElement } from '../errors/messages.js';
import { type CscPattern, compressPattern, type FactorCapacity, type SymbolicLu } from '../linalg/index.js';

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
  /** Element name → its position in {@link CompiledSystem.devices} and {@link CompiledSystem.records}. */
  readonly deviceIndex: PositionIndex;
  /** The compiled device of an element, by name. */
  readonly deviceByName: DeviceLookup;
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
  /** Computes {@link CompiledSystem.elementsAt} on its first call, then returns the same lists. */
  readonly touching: () => readonly (readonly string[])[];
  readonly records: readonly ElementRecord[];
  /** The unknowns each device numbered for itself (internal nodes, then branches), by device position. */
  readonly allocations: readonly (readonly number[])[];
  /**
   * The symbolic LU analysis of the first factored Jacobian, shared by every solver on this pattern
   * (later Newton workspaces, the AC analyses): one ordering per topology; and the entries that
   * factorization stored in L and U, so that later solvers reserve their storage once.
   */
  readonly ordering: SharedOrdering;
}

/** The ordering every solver on one pattern shares, and the fill of its first factorization. */
export interface SharedOrdering {
  symbolic: SymbolicLu | null;
  fill: FactorCapacity | null;
}

/** Devices by element name, answered from the position table and the device array. */
export interface DeviceLookup {
  /** The device of that element, or undefined. */
  get(name: string): Device | undefined;
}

/**
 * Element name → position, built on the first look-up: an analysis of the whole circuit never looks
 * an element up by name, and the table costs about 36 bytes an element (3.6 MB at 100,000).
 */
export class PositionIndex {
  readonly #map: () => ReadonlyMap<string, number>;
  constructor(records: readonly { readonly name: string }[]) {
    this.#map = once(() => new Map(records.map((record, k) => [record.name, k])));
  }
  get(name: string): number | undefined {
    return this.#map().get(name);
  }
}

function deviceLookup(index: PositionIndex, devices: readonly Device[]): DeviceLookup {
  return new DeviceTable(index, devices);
}

/** Devices by name through the position table: a value change makes one of these, not a map. */
class DeviceTable implements DeviceLookup {
  constructor(
    readonly index: PositionIndex,
    readonly devices: readonly Device[],
  ) {}
  get(name: string): Device | undefined {
    const k = this.index.get(name);
    return k === undefined ? undefined : this.devices[k];
  }
}

let compilations = 0;

/** How many circuits this process has compiled: lets tests see that a cached system was reused. */
export function compileCount(): number {
  return compilations;
}

/** Check and compile element records. Throws the topology errors of docs/building-circuits.md, "Errors". */
export function compileCircuit(records: readonly ElementRecord[]): CompiledSystem {
  const labels: UnknownLabel[] = [];
  const nodeIndex = new Map<string, number>();
  for (const record of records) {
    const fields = terminalFields(record);
    for (let t = 0; t < fields.length; t++) {
      const node = (record as unknown as Readonly<Record<string, string>>)[fields[t]!]!;
      if (node !== GROUND && !nodeIndex.has(node)) {
        nodeIndex.set(node, labels.length);
        labels.push({ kind: 'node', name: node });
      }
    }
  }
  checkTopology(records, nodeIndex);
  compilations++;
  const devices = records.map(createDevice);
  const branchIndex = new Map<string, number>();
  let branchesOpen = false;
  const NONE: readonly number[] = [];
  const allocations: (readonly number[])[] = new Array(devices.length).fill(NONE);
  let owner = 0;
  const own = (k: number): number => {
    if (allocations[owner] === NONE) allocations[owner] = [];
    (allocations[owner] as number[]).push(k);
    return k;
  };
  const allocation: AllocationContext = {
    node: (name) => nodeIndex.get(name) ?? -1,
    internalNode(ownerName, label) {
      if (branchesOpen) throw new Error('internal nodes must be allocated before branches');
      labels.push({ kind: 'node', name: `${ownerName}#${label}` });
      return own(labels.length - 1);
    },
    branch(ownerName) {
      labels.push({ kind: 'branch', name: ownerName });
      if (!branchIndex.has(ownerName)) branchIndex.set(ownerName, labels.length - 1);
      return own(labels.length - 1);
    },
  };
  for (owner = 0; owner < devices.length; owner++) devices[owner]!.allocateNodes?.(allocation);
  const nodeCount = labels.length;
  branchesOpen = true;
  for (owner = 0; owner < devices.length; owner++) devices[owner]!.allocateBranches?.(allocation);
  const n = labels.length;
  nodeIndex.set(GROUND, n);

  // Slot requests land in chunks of one shared store, in request order: each device keeps a view
  // on its part, and one pass over the store fills every view once the pattern is compressed.
  // A small circuit starts with the room it needs; a large one grows from 1,024 by doubling (a
  // start sized from the device count overshot the need of the 100,000-element CMOS chain by 20 MB).
  const triplets = new TripletBuffer(Math.min(4 * devices.length + nodeCount, 1024));
  const store = new SlotStore();
  const bind: BindContext = {
    ...lookups(nodeIndex, branchIndex),
    slots(pairs) {
      for (let t = 0; t < pairs.length; t += 2) triplets.push(pairs[t]!, pairs[t + 1]!);
      return store.take(pairs.length >> 1);
    },
  };
  for (const d of devices) d.bind(bind);
  const diagonalPairs = new Array<number>(2 * nodeCount);
  for (let i = 0; i < 2 * nodeCount; i++) diagonalPairs[i] = i >> 1;
  const diagonalRequest = bind.slots(diagonalPairs);

  // Ground rows and columns go to the trash slot nnz; the rest are compressed.
  const { pattern, slots } = compressPattern(n, triplets.rows, triplets.cols, triplets.count);
  const nnz = pattern.Ai.length;
  store.fill(slots);

  const deviceIndex = new PositionIndex(records);
  return assemble({
    n,
    nodeCount,
    labels,
    nodeIndex,
    devices,
    deviceIndex,
    branchIndex,
    pattern,
    nnz,
    nodeDiagonal: diagonalRequest,
    records,
    allocations,
    ordering: { symbolic: null, fill: null },
    touching: lazyElementsTouching(records, labels, nodeIndex, branchIndex, n),
  });
}

/**
 * A compiled system from its parts. Built here, not where the parts were made: a function created
 * inside compileCircuit (this getter, say) would keep that call's whole scope alive, its triplet and
 * slot buffers included, as long as the system lives.
 */
function assemble(parts: Omit<CompiledSystem, 'deviceByName' | 'elementsAt' | 'nonlinear'>): CompiledSystem {
  const touching = parts.touching;
  return {
    ...parts,
    deviceByName: deviceLookup(parts.deviceIndex, parts.devices),
    nonlinear: parts.devices.some((d) => d.nonlinear),
    get elementsAt() {
      return touching();
    },
  };
}

/** {@link elementsTouching}, computed on first use (only messages need it). */
function lazyElementsTouching(
  records: readonly ElementRecord[],
  labels: readonly UnknownLabel[],
  nodeIndex: ReadonlyMap<string, number>,
  branchIndex: ReadonlyMap<string, number>,
  n: number,
): () => readonly (readonly string[])[] {
  return once(() => elementsTouching(records, labels, nodeIndex, branchIndex, n));
}

/** The name lookups of a bind context: node and branch-current unknowns by name. */
function lookups(
  nodeIndex: ReadonlyMap<string, number>,
  branchIndex: ReadonlyMap<string, number>,
): Pick<BindContext, 'node' | 'branchOf'> {
  return {
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
  };
}

/** A function that computes `make()` on its first call and returns that value ever after. */
function once<T>(make: () => T): () => T {
  let value: T | undefined;
  return () => {
    value ??= make();
    return value;
  };
}

/** Names of the elements touching each unknown, for messages about singular rows and residuals. */
function elementsTouching(
  records: readonly ElementRecord[],
  labels: readonly UnknownLabel[],
  nodeIndex: ReadonlyMap<string, number>,
  branchIndex: ReadonlyMap<string, number>,
  n: number,
): string[][] {
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
  return elementsAt;
}

/** Growable (row, column) triplet arrays, starting with room for `capacity` pairs. */
class TripletBuffer {
  rows: Int32Array;
  cols: Int32Array;
  count = 0;
  constructor(capacity: number) {
    this.rows = new Int32Array(Math.max(capacity, 16));
    this.cols = new Int32Array(Math.max(capacity, 16));
  }
  push(row: number, col: number): void {
    if (this.count === this.rows.length) {
      const rows = new Int32Array(2 * this.count);
      const cols = new Int32Array(2 * this.count);
      rows.set(this.rows);
      cols.set(this.cols);
      this.rows = rows;
      this.cols = cols;
    }
    this.rows[this.count] = row;
    this.cols[this.count] = col;
    this.count++;
  }
}

/**
 * Slot arrays handed to devices as views on a few chunks, in request order, so that binding
 * allocates no array per device and one pass fills them all. The chunks double from a small first
 * one up to a cap: the views keep their chunks alive as long as the compiled system, so a small
 * circuit must not hold a chunk sized for a large one (a fixed 256 KB chunk made every compiled
 * 30-element circuit hold 256 KB, and compiling many small circuits mostly collecting garbage).
 */
class SlotStore {
  static readonly FIRST_CHUNK = 256;
  static readonly LARGEST_CHUNK = 1 << 16;
  readonly #chunks: Int32Array[] = [];
  readonly #used: number[] = [];
  #nextChunk = SlotStore.FIRST_CHUNK;
  take(length: number): Int32Array {
    let last = this.#chunks.length - 1;
    if (last < 0 || this.#used[last]! + length > this.#chunks[last]!.length) {
      this.#chunks.push(new Int32Array(Math.max(this.#nextChunk, length)));
      this.#nextChunk = Math.min(2 * this.#nextChunk, SlotStore.LARGEST_CHUNK);
      this.#used.push(0);
      last++;
    }
    const start = this.#used[last]!;
    this.#used[last] = start + length;
    return this.#chunks[last]!.subarray(start, start + length);
  }
  /** Write slots[t] into the t-th slot taken. */
  fill(slots: Int32Array): void {
    let t = 0;
    for (let c = 0; c < this.#chunks.length; c++) {
      const chunk = this.#chunks[c]!;
      const used = this.#used[c]!;
      for (let k = 0; k < used; k++) chunk[k] = slots[t++]!;
    }
  }
}

/**
 * The system with the records of some elements replaced by records of the same topology (new values),
 * without compiling again: each new device numbers the same internal unknowns as the one it replaces
 * and takes its slots from the existing pattern. Returns null when a record changes the topology (it
 * asks for other unknowns or for a matrix entry the pattern lacks): the caller compiles afresh.
 */
export function withRecords(
  system: CompiledSystem,
  changed: readonly ElementRecord[],
): CompiledSystem | null {
  const devices = system.devices.slice();
  const records = system.records.slice();
  for (const record of changed) {
    const k = system.deviceIndex.get(record.name);
    if (k === undefined) return null;
    const device = rebind(system, k, record);
    if (device === null) return null;
    devices[k] = device;
    records[k] = record;
  }
  // Values do not change which elements touch an unknown: the lists are shared. Nothing here keeps
  // the previous system alive, however many value changes follow one another.
  return assemble({
    n: system.n,
    nodeCount: system.nodeCount,
    labels: system.labels,
    nodeIndex: system.nodeIndex,
    devices,
    deviceIndex: system.deviceIndex,
    branchIndex: system.branchIndex,
    pattern: system.pattern,
    nnz: system.nnz,
    nodeDiagonal: system.nodeDiagonal,
    records,
    allocations: system.allocations,
    ordering: system.ordering,
    touching: system.touching,
  });
}

/**
 * A device for `record` (element number k of `system`, with other values) bound into the existing
 * numbering and pattern, or null if it does not fit (it asks for other unknowns or entries).
 */
export function rebind(system: CompiledSystem, k: number, record: ElementRecord): Device | null {
  let binder = binders.get(system.pattern);
  if (binder === undefined || binder.system.labels !== system.labels) {
    binder = new Rebinder(system);
    binders.set(system.pattern, binder);
  }
  return binder.rebind(k, record);
}

/** One rebinder per pattern: value changes (a Monte Carlo sample, say) create no contexts or closures. */
const binders = new WeakMap<CscPattern, Rebinder>();

/**
 * The allocation and bind contexts of {@link rebind} as one object whose state is reset per call: the
 * recorded unknowns of the element being rebound are replayed, and slots are looked up in the pattern.
 */
class Rebinder implements AllocationContext, BindContext {
  #recorded: readonly number[] = [];
  #cursor = 0;
  #fits = true;
  readonly #lookups: Pick<BindContext, 'node' | 'branchOf'>;

  constructor(readonly system: CompiledSystem) {
    this.#lookups = lookups(system.nodeIndex, system.branchIndex);
  }

  rebind(k: number, record: ElementRecord): Device | null {
    const device = createDevice(record);
    this.#recorded = this.system.allocations[k]!;
    this.#cursor = 0;
    this.#fits = true;
    device.allocateNodes?.(this);
    device.allocateBranches?.(this);
    if (!this.#fits || this.#cursor !== this.#recorded.length) return null;
    device.bind(this);
    return this.#fits ? device : null;
  }

  node(name: string): number {
    return this.#lookups.node(name);
  }

  branchOf(name: string): number {
    return this.#lookups.branchOf(name);
  }

  internalNode(owner: string, label: string): number {
    return this.#replay('node', `${owner}#${label}`);
  }

  branch(owner: string): number {
    return this.#replay('branch', owner);
  }

  #replay(kind: UnknownLabel['kind'], name: string): number {
    const index = this.#recorded[this.#cursor++];
    const label = index === undefined ? undefined : this.system.labels[index];
    if (label === undefined || label.kind !== kind || label.name !== name) {
      this.#fits = false;
      return this.system.n;
    }
    return index!;
  }

  slots(pairs: readonly number[]): Int32Array {
    const { n, nnz } = this.system;
    const { Ap, Ai } = this.system.pattern;
    const target = new Int32Array(pairs.length / 2);
    for (let t = 0; t < target.length; t++) {
      const i = pairs[2 * t]!;
      const j = pairs[2 * t + 1]!;
      if (i >= n || j >= n) {
        target[t] = nnz;
        continue;
      }
      // Rows are sorted within each column of the pattern.
      let lo = Ap[j]!;
      let hi = Ap[j + 1]! - 1;
      let found = -1;
      while (lo <= hi) {
        const mid = (lo + hi) >> 1;
        const row = Ai[mid]!;
        if (row === i) {
          found = mid;
          break;
        }
        if (row < i) lo = mid + 1;
        else hi = mid - 1;
      }
      if (found < 0) this.#fits = false;
      target[t] = found < 0 ? nnz : found;
    }
    return target;
  }
}
