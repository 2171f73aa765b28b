/**
 * Publishes the demo trials named on the command line, each as its owner, through the app's
 * own path (publishTrial in lib/summaries/publish.ts): the stored summary, its numbers, the
 * published date and the audit entry are what a researcher's click would leave. The seed runs
 * this in a child process (see publishDemoTrials in ./seed.ts); DATABASE_URL names the database.
 */
import { db } from "@/lib/db/sequelize";
import { publishTrial } from "@/lib/summaries/publish";
import { Trial, User } from "@/models";

async function main(trialIds: string[]): Promise<void> {
  db();
  try {
    for (const trialId of trialIds) {
      const trial = await Trial.findByPk(trialId);
      const owner = trial ? await User.findByPk(trial.ownerId) : null;
      if (!trial || !owner) throw new Error(`demo trial ${trialId} or its owner is missing`);
      await publishTrial({ id: owner.id, email: owner.email, name: owner.name, role: owner.role }, trialId, { source: "demo seed" });
    }
  } finally {
    await db().close();
  }
}

main(process.argv.slice(2)).then(
  // Exit at once: nothing else is left to do, and no stray timer may keep the seed waiting.
  () => process.exit(0),
  (error: Error) => {
    process.stderr.write(`publishing the demo failed: ${error.stack ?? error.message}\n`);
    process.exit(1);
  },
);
