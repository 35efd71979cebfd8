import { log, run, runAttached } from './stack/run.ts';
import { onShutdown } from './stack/signals.ts';
import { projectDir, startStack } from './stack/stack.ts';
import { ensureReferenceTools } from './stack/reference-tools.ts';

/**
 * `npm test`: the house checks (formatter, linter with the import boundaries), the typecheck,
 * then the test stack (its own PostgreSQL cluster and ports, beside any
 * running `npm start`), the client build the browser tests load, Debian's Chromium when missing,
 * and vitest over the unit, integration and browser projects. Everything started is stopped,
 * also after a failure; the exit code is the first failure's.
 */
const node = process.execPath;
const bin = (name: string) => `node_modules/${name}`;

const checks: Array<[string, string[]]> = [
  ['formatting (prettier --check)', [bin('prettier/bin/prettier.cjs'), '--check', '--log-level', 'warn', '.']],
  ['lint and import boundaries (eslint)', [bin('eslint/bin/eslint.js'), '--max-warnings', '0', '.']],
];
for (const [what, args] of checks) {
  log(what);
  const code = await runAttached(node, args, { cwd: projectDir });
  if (code !== 0) {
    log(`${what} failed: \`npx prettier --write .\` fixes formatting; the linter names each rule it applied`);
    process.exit(code);
  }
}

log('typecheck: server, shared, client, browser tests, client unit tests');
for (const project of ['tsconfig.json', 'shared', 'src', 'tests/browser', 'tests/unit/client']) {
  const code = await runAttached(node, [bin('typescript/bin/tsc'), '-p', project], { cwd: projectDir });
  if (code !== 0) {
    log(`typecheck of ${project} failed`);
    process.exit(code);
  }
}

const stack = await startStack('test').catch((error: Error) => {
  log(`could not start the test stack: ${error.message}`);
  process.exit(1);
});
onShutdown(() => stack.stop());

let code = 1;
try {
  await Promise.all([
    ensureReferenceTools({ chromium: true }),
    (async () => {
      log('building the client for the browser tests…');
      await run(node, [bin('vite/bin/vite.js'), 'build', '--logLevel', 'warn'], { cwd: projectDir });
    })(),
  ]);
  code = await runAttached(node, [bin('vitest/vitest.mjs'), 'run', '--reporter=verbose', ...process.argv.slice(2)], {
    cwd: projectDir,
    env: { ...process.env, ...stack.env, TEST_DATABASE_TEMPLATE_URL: stack.env.DATABASE_URL!, CHROMIUM_PATH: '/usr/bin/chromium' },
  });
} catch (error) {
  log(`test run failed before the tests: ${(error as Error).message}`);
} finally {
  await stack.stop();
}
process.exit(code);
