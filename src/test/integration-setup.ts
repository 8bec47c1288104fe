// Integration tests run against the services `npm test` started; fail fast with a clear message otherwise.
if (!process.env.DATABASE_URL || !process.env.S3_ENDPOINT || !process.env.SMTP_URL) {
  throw new Error("integration tests need the services that `npm test` starts: run them with `npm test`");
}
