/**
 * The operations are marked server-only for the Next bundler; a benchmark runs them in plain
 * Node, so the guard module is replaced by an empty one before anything loads it.
 */
import { createRequire } from "node:module";

const require = createRequire(import.meta.url);
const path = require.resolve("server-only");
require.cache[path] = { id: path, filename: path, loaded: true, exports: {} } as NodeJS.Module;
