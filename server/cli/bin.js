#!/usr/bin/env node
// The `taulens` command: runs the compiled CLI when the server has been built since the sources last changed, else
// the TypeScript sources through ts-node (transpile only, so start-up stays short). A stale build never runs.
'use strict';
const fs = require('node:fs');
const path = require('node:path');

const root = path.resolve(__dirname, '..', '..');
const compiled = path.join(root, 'dist', 'server', 'server', 'cli', 'main.js');

/** The newest modification time of the server's TypeScript sources (specs left out). */
function newestSource_ms(dir) {
  let newest = 0;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource_ms(full));
    else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.spec.ts')) newest = Math.max(newest, fs.statSync(full).mtimeMs);
  }
  return newest;
}

const built = fs.existsSync(compiled) && fs.statSync(compiled).mtimeMs >= newestSource_ms(path.join(root, 'server'));
if (built) {
  require(compiled).run(process.argv.slice(2));
} else {
  require('ts-node').register({ transpileOnly: true, project: path.join(root, 'tsconfig.server.json') });
  require(path.join(__dirname, 'main.ts')).run(process.argv.slice(2));
}
