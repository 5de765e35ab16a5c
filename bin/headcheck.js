#!/usr/bin/env node
// The installed command: runs the CLI bundled into one file (built by `npm ci`'s prepare step; batch, serve, demo,
// compare's outputs and DWG load as chunks only for their command).
import { main } from '../dist/cli-bundle/main.js';
main(process.argv).then((code) => { process.exitCode = code; });
