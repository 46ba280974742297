#!/usr/bin/env bash
# Type-checks the packed package as its users see it: `npm pack` the built package, unpack the tarball
# into scratch projects under a temporary directory, one per module setting a TypeScript project uses
# (nodenext with ESM and CommonJS files, node16, bundler, and classic CommonJS), and compile a small
# program there with the repository's tsc. The program reads complex results and marks with
# @ts-expect-error the lines that must not compile, so a declaration that decays to `any` fails too.
# Run after `npm run build`.
set -euo pipefail
repo="$(cd "$(dirname "$0")/.." && pwd)"
tsc="$repo/node_modules/.bin/tsc"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT

tarball="$(cd "$repo" && npm pack --silent --pack-destination "$work" | tail -n 1)"

# The program, written once; each project compiles it as an ES module or a CommonJS file.
read -r -d '' program <<'TS' || true
import { Circuit, GROUND, acAnalysis, operatingPoint } from 'quiescent';
import { assertNodeVoltage, checkGain } from 'quiescent/testing';

const circuit = new Circuit()
  .voltageSource('drive', 'in', GROUND, { dc: 0, ac: 1 })
  .resistor('R1', 'in', 'out', '1k')
  .capacitor('C1', 'out', GROUND, '100n');
const op = operatingPoint(circuit);
const ac = acAnalysis(op, { frequencies: [1591.5] });
const gain = ac.gain('out', 'in')[0];
if (gain === undefined) throw new Error('no gain');
const magnitude: number = gain.abs();
const real: number = gain.re;
const phase: number = gain.arg();
const scaled = gain.mul(2).div(gain);
const impedance: number = ac.sourceImpedance('drive')[0]?.abs() ?? 0;
// A complex result is a Complex, not `any`: these must not compile.
// @ts-expect-error a Complex is not a string
const wrong: string = gain;
// @ts-expect-error a Complex has no such method
gain.notAMethod();
assertNodeVoltage(op, 'out', 0, { absolute: 1e-9 });
const check = checkGain(ac, { output: 'out', input: 'in', frequency: 1591.5 }, -3, { absolute: 0.1 });
export const used = [magnitude, real, phase, scaled, impedance, wrong, check.pass];
TS

# project name, package.json "type", then compiler options as JSON.
project() {
  local name="$1" type="$2" options="$3" dir="$work/$1"
  mkdir -p "$dir/node_modules/quiescent"
  tar -xzf "$work/$tarball" -C "$dir/node_modules/quiescent" --strip-components=1
  ln -s "$repo/node_modules/complex.js" "$dir/node_modules/complex.js"
  printf '{ "name": "check-%s", "private": true, "type": "%s" }\n' "$name" "$type" >"$dir/package.json"
  printf '{ "compilerOptions": %s, "include": ["*.ts", "*.mts", "*.cts"] }\n' "$options" >"$dir/tsconfig.json"
}

common='"strict": true, "noEmit": true, "types": [], "lib": ["ES2022"], "target": "ES2022"'

project nodenext module "{ $common, \"module\": \"nodenext\", \"moduleResolution\": \"nodenext\" }"
printf '%s\n' "$program" >"$work/nodenext/esm.mts"
printf '%s\n' "$program" >"$work/nodenext/commonjs.cts"

project nodenext-skiplibcheck module "{ $common, \"module\": \"nodenext\", \"moduleResolution\": \"nodenext\", \"skipLibCheck\": true }"
printf '%s\n' "$program" >"$work/nodenext-skiplibcheck/index.ts"

project node16 module "{ $common, \"module\": \"node16\", \"moduleResolution\": \"node16\" }"
printf '%s\n' "$program" >"$work/node16/index.ts"

project bundler module "{ $common, \"module\": \"esnext\", \"moduleResolution\": \"bundler\" }"
printf '%s\n' "$program" >"$work/bundler/index.ts"

project commonjs commonjs "{ $common, \"module\": \"commonjs\", \"moduleResolution\": \"node10\", \"esModuleInterop\": true }"
printf '%s\n' "$program" >"$work/commonjs/index.ts"

status=0
for name in nodenext nodenext-skiplibcheck node16 bundler commonjs; do
  if (cd "$work/$name" && "$tsc" -p tsconfig.json); then
    echo "package types: $name ok"
  else
    echo "package types: $name FAILED" >&2
    status=1
  fi
done
exit "$status"
