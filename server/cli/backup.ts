import { resolve } from "node:path";
import { loadEnv } from "../config.js";
import { backup, restore } from "../backup/backup.js";

// npx tsx server/cli/backup.ts backup <dir>   — with DATABASE_URL and S3_ENDPOINT of the instance
// npx tsx server/cli/backup.ts restore <dir>  — into an EMPTY database and bucket
const [command, dir] = process.argv.slice(2);
const env = loadEnv();
if (!dir || !["backup", "restore"].includes(command) || !env.DATABASE_URL || !env.S3_ENDPOINT) {
  console.error("usage: DATABASE_URL=… S3_ENDPOINT=… [S3_BUCKET=…] npx tsx server/cli/backup.ts backup|restore <dir>");
  process.exit(2);
}
const store = { endpoint: env.S3_ENDPOINT, bucket: env.S3_BUCKET, region: env.S3_REGION, accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY };
const result = command === "backup" ? await backup(env.DATABASE_URL, store, resolve(dir)) : await restore(resolve(dir), env.DATABASE_URL, store);
console.log(`${command}: ${JSON.stringify(result)}`);
