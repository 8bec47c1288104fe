// `npm start`: local services, migrations, demo data, a production build, and the app on 127.0.0.1:3000.
import { buildIfNeeded, migrate, serveApp, startWorker } from "./app";
import { log, SetupError } from "./processes";
import { profile } from "./profile";
import { startServices } from "./services";

const dev = profile("dev");
try {
  const env = await startServices(dev);
  await migrate(env);
  const built = buildIfNeeded(env);
  await serveApp(dev, env, built);
  await startWorker(dev, env, "ingest,mail");
  log("");
  log(`Lotwarden is running: ${env.APP_URL}`);
  if (env.MAIL_FAKE_URL) log(`captured e-mail: ${env.APP_URL}/dev/outbox`);
  log(`logs: ${dev.dataDir}/logs · stop everything with: npm run stop`);
} catch (error) {
  if (error instanceof SetupError) {
    process.stderr.write(`lotwarden: ${error.message}\n`);
    process.exit(1);
  }
  throw error;
}
