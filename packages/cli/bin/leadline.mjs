#!/usr/bin/env node
// The workspace runs TypeScript from source: tsx's loader compiles it on the fly.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/main.ts');
process.exitCode = await main(process.argv.slice(2));
