#!/usr/bin/env node
import { runCli } from './main.js';

runCli(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`sorbshare: internal error: ${String(e)}\n`);
    process.exitCode = 1;
  },
);
