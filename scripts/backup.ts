/** `npm run backup [-- <folder>]`: database dump plus the stored files it names, with a checksum manifest. */
import path from "node:path";
import { config } from "@/lib/config";
import { createBackup } from "@/lib/ops/backup";

async function main(): Promise<void> {
  const folder = path.resolve(process.argv[2] ?? path.join("backups", `hoebench-${new Date().toISOString().replace(/[:.]/g, "-")}`));
  const manifest = await createBackup(config(), folder);
  const rows = Object.values(manifest.database.rowCounts).reduce((sum, count) => sum + count, 0);
  process.stdout.write(`backup written to ${folder}: ${Object.keys(manifest.database.rowCounts).length} tables, ${rows} rows, ${manifest.objects.length} files\n`);
  if (manifest.missing.length) process.stdout.write(`warning: ${manifest.missing.length} referenced files were not in storage (listed in manifest.json)\n`);
}

main().catch((error: Error) => {
  process.stderr.write(`backup failed: ${error.message}\n`);
  process.exit(1);
});
