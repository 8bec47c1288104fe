// `npm start`: local services, migrations, demo data, a production build, and the app on 127.0.0.1:3000.
import { buildIfNeeded, migrate, serveApp, startWorker } from "./app";
import { log, SetupError } from "./processes";
import { profile } from "./profile";
import { DEMO_PASSWORD, seedDemo } from "./seed";
import { startServices } from "./services";

const dev = profile("dev");
try {
  const env = await startServices(dev);
  await migrate(env);
  const built = buildIfNeeded(env);
  await serveApp(dev, env, built);
  await startWorker(dev, env, "ingest,mail");
  await seedDemo(env);
  log("");
  log(`Lotwarden is running: ${env.APP_URL}`);
  log(`demo sign-ins (password ${DEMO_PASSWORD}; the demo data is invented):`);
  for (const [email, what] of [
    ["admin@tidewater.example", "Tidewater Microfab admin"],
    ["engineer@tidewater.example", "process engineer"],
    ["analyst@tidewater.example", "yield analyst"],
    ["viewer@vellacourt.example", "customer: Vellacourt Devices"],
    ["viewer@amberlin.example", "customer: Amberlin Analog"],
    ["admin@copperfield.example", "Copperfield Foundry admin (a second tenant)"],
  ] as const) log(`  ${email.padEnd(30)} ${what}`);
  if (env.MAIL_FAKE_URL) log(`captured e-mail: ${env.APP_URL}/dev/outbox`);
  log(`logs: ${dev.dataDir}/logs · stop everything with: npm run stop`);
} catch (error) {
  if (error instanceof SetupError) {
    process.stderr.write(`lotwarden: ${error.message}\n`);
    process.exit(1);
  }
  throw error;
}
