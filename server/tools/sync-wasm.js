#!/usr/bin/env node
// Copies web-ifc's .wasm files into wasm/ (the one place server and client load them from) and
// records their version; `--check` only verifies that wasm/ matches the installed web-ifc.
'use strict';
const fs = require('node:fs');
const path = require('node:path');
const crypto = require('node:crypto');

const root = path.resolve(__dirname, '..', '..');
const wasmDir = path.join(root, 'wasm');
const manifestPath = path.join(wasmDir, 'manifest.json');

function sha256(file) {
  return crypto.createHash('sha256').update(fs.readFileSync(file)).digest('hex');
}

function installedWebIfc() {
  const pkgDir = path.dirname(require.resolve('web-ifc', { paths: [root] }));
  const version = JSON.parse(fs.readFileSync(path.join(pkgDir, 'package.json'), 'utf8')).version;
  const files = fs.readdirSync(pkgDir).filter((f) => f.endsWith('.wasm')).sort();
  return { pkgDir, version, files };
}

function check() {
  const { pkgDir, version, files } = installedWebIfc();
  if (!fs.existsSync(manifestPath)) return `wasm/manifest.json is missing; run: node server/tools/sync-wasm.js`;
  const manifest = JSON.parse(fs.readFileSync(manifestPath, 'utf8'));
  if (manifest.webIfcVersion !== version) return `wasm/ holds web-ifc ${manifest.webIfcVersion}, installed is ${version}`;
  for (const f of files) {
    const copy = path.join(wasmDir, f);
    if (!fs.existsSync(copy)) return `wasm/${f} is missing`;
    if (sha256(copy) !== sha256(path.join(pkgDir, f))) return `wasm/${f} differs from web-ifc ${version}`;
  }
  return null;
}

function sync() {
  const { pkgDir, version, files } = installedWebIfc();
  fs.mkdirSync(wasmDir, { recursive: true });
  const entries = {};
  for (const f of files) {
    fs.copyFileSync(path.join(pkgDir, f), path.join(wasmDir, f));
    entries[f] = sha256(path.join(wasmDir, f));
  }
  fs.writeFileSync(manifestPath, JSON.stringify({ webIfcVersion: version, files: entries }, null, 2) + '\n');
}

if (process.argv.includes('--check')) {
  const problem = check();
  if (problem) {
    console.error(`wasm check failed: ${problem}`);
    process.exit(1);
  }
  console.log('wasm/ matches the installed web-ifc');
} else {
  sync();
}
