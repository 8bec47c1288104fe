// `npm run dev`: the same local services as `npm start`, with `next dev` (hot reload) in the foreground.
import { spawn } from "node:child_process";
import path from "node:path";
import { migrate } from "./app";
import { stopRecorded } from "./processes";
import { profile, projectRoot } from "./profile";
import { startServices } from "./services";

const dev = profile("dev");
const env = await startServices(dev);
await migrate(env);
await stopRecorded(dev.dataDir, "app"); // the production server would hold the port
const child = spawn(process.execPath, [path.join(projectRoot, "node_modules/next/dist/bin/next"), "dev", "-H", "127.0.0.1", "-p", String(dev.appPort)], {
  cwd: projectRoot,
  stdio: "inherit",
  env: { ...process.env, ...env, NODE_ENV: "development" },
});
for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => child.kill(signal));
child.on("exit", (code) => process.exit(code ?? 0));
