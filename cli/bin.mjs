#!/usr/bin/env node
// The `plumbline` command when the package is installed: loads the TypeScript
// sources through tsx, resolved from this file, so it runs from any directory.
import { register } from 'tsx/esm/api'

register()
await import('./plumbline.ts')
