// Test support: a worker-thread entry that loads the TypeScript module named by its last argv through tsx, so
// tests can start from source the threads that the built app starts from its bundle.
import { register } from "tsx/esm/api";

register();
await import(process.argv.at(-1));
