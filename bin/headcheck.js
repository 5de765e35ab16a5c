#!/usr/bin/env node
// The installed command: runs the compiled CLI (built by `npm ci`'s prepare step).
import { main } from '../dist/cli/main.js';
main(process.argv).then((code) => { process.exitCode = code; });
