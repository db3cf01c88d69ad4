#!/usr/bin/env node
// Launcher: runs the TypeScript entry point through tsx, so the installed command needs no build step.
import { register } from 'tsx/esm/api';

register();
await import('../src/main.ts');
