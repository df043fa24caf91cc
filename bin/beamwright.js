#!/usr/bin/env node
// CLI entry: runs the TypeScript CLI (src/cli/main.ts) over the same engine as the app.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
