#!/usr/bin/env node
'use strict';
// The `rungs` command: a tiny launcher for the bundled CLI (built by `npm run build`).
const path = require('node:path');
const fs = require('node:fs');
const bundle = path.join(__dirname, '..', '..', 'dist', 'rungs.js');
if (!fs.existsSync(bundle)) {
  process.stderr.write('rungs: the CLI is not built yet; run `npm run build` first.\n');
  process.exit(2);
}
require(bundle).run();
