#!/usr/bin/env node
// The `freezeline` command: registers the TypeScript loader (tsx) and runs the CLI source directly.
import { register } from 'tsx/esm/api';

register();
await import('./main.ts');
