import { builtinModules } from 'node:module';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

/**
 * The `plumbline` command bundled into one ES module (dist/cli/main.js), so that starting it loads
 * one file instead of ~140: Node's ESM loader costs roughly 0.5 ms per module here, about a third of
 * the command's startup. Only Node's built-ins stay external; the CLI imports nothing else outside
 * the repository. `npm run build` runs `tsc -p tsconfig.build.json` first (the server and its
 * workers still run from the per-file output in dist/server and dist/core), then this build
 * overwrites dist/cli/main.js; `postbuild` makes it executable. The `#!/usr/bin/env node` line of
 * cli/main.ts is kept at the top of the bundle.
 */
const root = fileURLToPath(new URL('..', import.meta.url));
const nodeBuiltins = [...builtinModules, ...builtinModules.map((m) => `node:${m}`)];

export default defineConfig({
  root,
  publicDir: false,
  logLevel: 'warn',
  ssr: { noExternal: true, external: nodeBuiltins },
  build: {
    ssr: fileURLToPath(new URL('./main.ts', import.meta.url)),
    outDir: 'dist/cli',
    emptyOutDir: false,
    target: 'node20',
    minify: false,
    sourcemap: false,
    copyPublicDir: false,
    rollupOptions: {
      external: nodeBuiltins,
      output: { format: 'es', entryFileNames: 'main.js', codeSplitting: false },
    },
  },
});
