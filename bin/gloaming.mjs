#!/usr/bin/env node
// Entry point of the `gloaming` command. The library is TypeScript run through Node's type
// stripping, which needs Node 22.18 or later; the project pins Node 24 as a devDependency, so
// `npx gloaming` and npm scripts run on it. Under an older Node this says so instead of failing obscurely.
const [major, minor] = process.versions.node.split('.').map(Number);
if (major < 22 || (major === 22 && minor < 18)) {
  console.error(
    `gloaming needs Node 22.18 or later (this is ${process.versions.node}). ` +
      "Run it through 'npx gloaming' or an npm script, which use the Node pinned in node_modules/.bin.",
  );
  process.exit(1);
}
const { main } = await import('../lib/outputs/cli/main.ts');
// The edge of the command line reads the clock (for `check`'s default span); lib/ never does.
const today = process.env.GLOAMING_TODAY || new Date().toISOString().slice(0, 10);
process.exitCode = main(process.argv.slice(2), console.log, console.error, { today });
