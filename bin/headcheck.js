#!/usr/bin/env node
// The installed command: runs the command line bundled into one file, from its code cache where Node accepts it
// (bin/load-cli.js); batch, serve, demo and DWG load as chunks only for their command.
import { loadCli } from './load-cli.js';

loadCli().cli.main(process.argv).then((code) => {
  process.exitCode = code;
});
