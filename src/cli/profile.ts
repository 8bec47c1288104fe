// Where each local service of a profile listens and keeps its data. `dev` serves `npm start` and `npm run dev`,
// `test` serves `npm test`; they never share ports or data.
import path from "node:path";
import { fileURLToPath } from "node:url";

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

export interface Profile {
  name: "dev" | "test";
  dataDir: string;
  pgPort: number;
  s3Port: number;
  smtpPort: number;
  mailApiPort: number;
  appPort: number;
  fastPostgres: boolean;
}

function port(variable: string, fallback: number): number {
  const raw = process.env[variable];
  if (!raw) return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 1 || value > 65535) throw new Error(`${variable} must be a port number, got "${raw}"`);
  return value;
}

export function profile(name: "dev" | "test"): Profile {
  const dataDir = process.env.LOTWARDEN_DATA_DIR ? path.resolve(process.env.LOTWARDEN_DATA_DIR, name) : path.join(projectRoot, ".data", name);
  if (name === "dev") {
    return {
      name, dataDir, fastPostgres: false,
      pgPort: port("LOTWARDEN_PG_PORT", 54329),
      s3Port: port("LOTWARDEN_S3_PORT", 54331),
      smtpPort: port("LOTWARDEN_SMTP_PORT", 54325),
      mailApiPort: port("LOTWARDEN_MAIL_API_PORT", 54326),
      appPort: port("PORT", 3000),
    };
  }
  return {
    name, dataDir, fastPostgres: true,
    pgPort: port("LOTWARDEN_TEST_PG_PORT", 54339),
    s3Port: port("LOTWARDEN_TEST_S3_PORT", 54341),
    smtpPort: port("LOTWARDEN_TEST_SMTP_PORT", 54335),
    mailApiPort: port("LOTWARDEN_TEST_MAIL_API_PORT", 54336),
    appPort: port("LOTWARDEN_TEST_APP_PORT", 3100),
  };
}
