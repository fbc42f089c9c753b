#!/usr/bin/env node
import process from 'node:process'
import {run} from './lib/program.ts'

process.exitCode = await run(process.argv.slice(2), {
  cwd: process.cwd(),
  env: process.env,
  stdout: process.stdout,
  stderr: process.stderr
})
