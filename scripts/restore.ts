/** `npm run restore -- <folder>`: restores a backup into an empty database and bucket. */
import path from "node:path";
import { config } from "@/lib/config";
import { restoreBackup } from "@/lib/ops/restore";

async function main(): Promise<void> {
  const folder = process.argv[2];
  if (!folder) throw new Error("name the backup folder: npm run restore -- <folder>");
  const result = await restoreBackup(config(), path.resolve(folder));
  process.stdout.write(`restored ${result.tables} tables and ${result.objects} files from ${folder}\n`);
}

main().catch((error: Error) => {
  process.stderr.write(`restore failed: ${error.message}\n`);
  process.exit(1);
});
