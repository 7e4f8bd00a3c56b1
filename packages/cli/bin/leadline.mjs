#!/usr/bin/env node
// Runs the command line from its bundle (bin/bundle.mjs), rebuilt first when a source changed.
import { ensureBundles } from './bundle.mjs';

const { main } = await import(await ensureBundles());
process.exitCode = await main(process.argv.slice(2));
