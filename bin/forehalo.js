#!/usr/bin/env node
// Runs the compiled CLI (npm run build writes dist/). From a checkout: npx tsx src/cli/main.ts.
import { main } from '../dist/src/cli/main.js';

process.exitCode = await main(process.argv);
