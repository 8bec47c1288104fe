// Entry point of `npm start`, `npm test`, `npm run dev`, `npm run stop`.
// Plain Node.js with no dependencies: on a fresh clone nothing is installed yet, so this file installs what is
// missing (npm packages, Debian packages) and then hands over to the TypeScript command in src/cli/.
import { spawnSync, spawn } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const command = process.argv[2] ?? "start";
const commands = { start: "start.ts", dev: "dev.ts", test: "test.ts", stop: "stop.ts"};

function say(message) {
  process.stdout.write(`lotwarden: ${message}\n`);
}

function fail(message) {
  process.stderr.write(`lotwarden: ${message}\n`);
  process.exit(1);
}

function run(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { stdio: "inherit", cwd: root, ...options });
  if (result.error) fail(`could not run ${cmd}: ${result.error.message}`);
  return result.status ?? 1;
}

function nodeModulesFresh() {
  const marker = path.join(root, "node_modules", ".package-lock.json");
  if (!existsSync(marker)) return false;
  return statSync(marker).mtimeMs >= statSync(path.join(root, "package-lock.json")).mtimeMs - 1000;
}

function findPostgresBin() {
  const base = "/usr/lib/postgresql";
  if (!existsSync(base)) return null;
  const versions = readdirSync(base).filter((v) => existsSync(path.join(base, v, "bin", "initdb")));
  versions.sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], "bin") : null;
}

function aptInstall(packages) {
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  const prefix = isRoot ? [] : ["sudo", "-n"];
  say(`installing Debian packages: ${packages.join(" ")}`);
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  const apt = (args) => run(prefix[0] ?? "apt-get", [...prefix.slice(1), ...(prefix.length ? ["apt-get"] : []), ...args], { env });
  if (apt(["update", "-qq"]) !== 0 || apt(["install", "-y", "-qq", ...packages]) !== 0) {
    fail(
      `could not install ${packages.join(", ")} with apt-get.` +
        (isRoot ? "" : " Run as root or install them yourself: sudo apt-get install -y " + packages.join(" ")),
    );
  }
}

if (!(command in commands)) fail(`unknown command "${command}" (start, dev, test, stop)`);

if (command !== "stop") {
  const major = Number(process.versions.node.split(".")[0]);
  if (major < 20) fail(`Node.js 20 or newer is needed (this is ${process.versions.node})`);
  if (!nodeModulesFresh()) {
    say("installing npm packages (npm ci)…");
    if (run("npm", ["ci", "--no-audit", "--no-fund"]) !== 0) fail("npm ci failed; see the messages above");
  }
  const needsPostgres = !process.env.DATABASE_URL && !findPostgresBin();
  const needsChromium = command === "test" && !existsSync(process.env.CHROMIUM_PATH ?? "/usr/bin/chromium");
  const missing = [...(needsPostgres ? ["postgresql"] : []), ...(needsChromium ? ["chromium"] : [])];
  if (missing.length) aptInstall(missing);
}

const child = spawn(process.execPath, ["--import", "tsx", path.join(root, "src/cli", commands[command]), ...process.argv.slice(3)], {
  stdio: "inherit",
  cwd: root,
  // The AWS SDK is pinned to a release that supports Node.js 20, so its notice about later releases is only noise.
  env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true", LOTWARDEN_COMMAND: command },
});
for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => child.kill(signal));
child.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
