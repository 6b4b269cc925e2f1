#!/usr/bin/env node
// The `taulens` command: runs the compiled CLI when the server has been built, else the TypeScript sources through
// ts-node (transpile only, so start-up stays short).
'use strict';
const fs = require('node:fs');
const path = require('node:path');

const root = path.resolve(__dirname, '..', '..');
const compiled = path.join(root, 'dist', 'server', 'server', 'cli', 'main.js');

if (fs.existsSync(compiled)) {
  require(compiled).run(process.argv.slice(2));
} else {
  require('ts-node').register({ transpileOnly: true, project: path.join(root, 'tsconfig.server.json') });
  require(path.join(__dirname, 'main.ts')).run(process.argv.slice(2));
}
