// `npm run stop`: stops, by process id, what `npm start` (or an interrupted `npm test`) started.
import { log } from "./processes";
import { profile } from "./profile";
import { stopServices } from "./services";

for (const name of process.argv.includes("--test") ? (["test"] as const) : (["dev", "test"] as const)) {
  const stopped = await stopServices(profile(name));
  if (stopped.length) log(`${name}: stopped ${stopped.join(", ")}`);
}
log("nothing of Lotwarden is running now");
