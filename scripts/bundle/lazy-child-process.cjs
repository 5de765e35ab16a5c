// node:child_process for the bundled command line, loaded at first use: commander requires it when it loads, for
// subcommands that are programs of their own (headcheck has none); loading it cost a small check ~5 ms.
let loaded;
module.exports = new Proxy(
  {},
  {
    get: (_, name) => {
      loaded ??= require('child_process'); // not node:child_process, which the bundle's alias makes this file
      return loaded[name];
    },
  },
);
