#!/usr/bin/env node
// The installed command: runs the command line bundled into one file, from its code cache where Node accepts it
// (bin/load-cli.js); batch, serve, demo and DWG load as chunks only for their command. CommonJS (bin/package.json):
// an ES module entry cost a small check ~10 ms of Node's module loader.
const { loadCli } = require('./load-cli.js');

loadCli()
  .cli.main(process.argv)
  .then((code) => {
    process.exitCode = code;
  });
