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
// Node keeps the compiled code of the modules it loads in its compile cache (a folder under the
// system's temporary folder), so the next command starts sooner; see DEVELOPERS.md.
(await import('node:module')).enableCompileCache?.();
const argv = process.argv.slice(2);
const wantsHelp = argv.includes('--help') || argv.includes('-h');

if ((argv[0] === 'build' || argv[0] === 'preview') && !wantsHelp) {
  // These start Astro, which lib/ never imports: the build script (scripts/build.ts) and Astro's preview server.
  if (argv[0] === 'build') {
    const { main } = await import('../scripts/build.ts');
    process.exitCode = await main(argv.slice(1));
  } else {
    const { parseArgs } = await import('node:util');
    const { resolve } = await import('node:path');
    const { fileURLToPath } = await import('node:url');
    const { values } = parseArgs({ args: argv.slice(1), options: { out: { type: 'string' }, port: { type: 'string' } } });
    const { preview } = await import('astro');
    const root = fileURLToPath(new URL('..', import.meta.url));
    // GLOAMING_TODAY only satisfies the content config, which a preview does not run.
    process.env.GLOAMING_TODAY ||= '2000-01-01';
    const server = await preview({ root, outDir: resolve(values.out ?? 'dist'), server: { port: Number(values.port ?? 4321) }, logLevel: 'info' });
    await server.closed();
  }
} else {
  // `init` asks for what it needs when run in a terminal; elsewhere (CI, scripts) flags are required.
  if (argv[0] === 'init' && !wantsHelp && process.stdin.isTTY) {
    const { INIT_QUESTIONS, missingInitFlags } = await import('../lib/outputs/cli/init.ts');
    const missing = missingInitFlags(argv.slice(1));
    if (missing.length) {
      const { createInterface } = await import('node:readline/promises');
      const rl = createInterface({ input: process.stdin, output: process.stdout });
      for (const q of INIT_QUESTIONS.filter((q) => missing.includes(q.flag))) argv.push(`--${q.flag}=${(await rl.question(q.question)).trim()}`);
      rl.close();
    }
  }
  const { main } = await import('../lib/outputs/cli/main.ts');
  // The edge of the command line reads the clock (for `check`'s default span); lib/ never does.
  const today = process.env.GLOAMING_TODAY || new Date().toISOString().slice(0, 10);
  process.exitCode = main(argv, console.log, console.error, { today });
}
