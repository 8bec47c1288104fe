// The local S3-compatible object store (s3rver), run as its own background process by the project's scripts.
// Usage: node --import tsx src/cli/s3-fake.ts <port> <directory>
import S3rver from "s3rver";

const [portArg, directory] = process.argv.slice(2);
if (!portArg || !directory) {
  process.stderr.write("usage: s3-fake.ts <port> <directory>\n");
  process.exit(2);
}

const server = new S3rver({ port: Number(portArg), address: "127.0.0.1", directory, silent: true });
server.run().then(
  () => process.stdout.write(`s3 fake listening on 127.0.0.1:${portArg}, data in ${directory}\n`),
  (error: unknown) => {
    process.stderr.write(`s3 fake failed to start: ${String(error)}\n`);
    process.exit(1);
  },
);
for (const signal of ["SIGTERM", "SIGINT"] as const) {
  process.on(signal, () => {
    server.close().finally(() => process.exit(0));
  });
}
