import type { Sequelize } from "sequelize";
import { hashPassword } from "@/lib/auth/password";
import { Membership, Site, Trial, User } from "@/models";
import { demoMemberships, demoSites, demoTrials, demoUsers, DEMO_PASSWORD } from "./scenario";

/** Seeds the demo into an empty database; a database with any user is left as it is. */
export async function seedDemo(sequelize: Sequelize): Promise<"seeded" | "already-present"> {
  if ((await User.count()) > 0) return "already-present";
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await sequelize.transaction(async (transaction) => {
    const users = new Map<string, User>();
    for (const demo of demoUsers) {
      users.set(demo.key, await User.create({ email: demo.email, name: demo.name, role: demo.role, passwordHash }, { transaction }));
    }
    const sites = new Map<string, Site>();
    for (const demo of demoSites) {
      const { key, ...fields } = demo;
      sites.set(key, await Site.create({ ...fields, latitude: null, longitude: null, createdById: users.get("researcher")!.id }, { transaction }));
    }
    const trials = new Map<string, Trial>();
    for (const demo of demoTrials) {
      trials.set(
        demo.key,
        await Trial.create(
          {
            title: demo.title,
            crop: demo.crop,
            season: demo.season,
            siteId: sites.get(demo.site)!.id,
            objective: demo.objective,
            design: "rcbd",
            blocks: demo.blocks,
            plotLengthM: 6,
            plotWidthM: 1.5,
            harvestAreaM2: 4.5,
            quadratAreaM2: 0.25,
            plantingDate: demo.plantingDate,
            randomSeed: demo.randomSeed,
            status: demo.status,
            ownerId: users.get(demo.owner)!.id,
          },
          { transaction },
        ),
      );
    }
    for (const demo of demoMemberships) {
      await Membership.create({ trialId: trials.get(demo.trial)!.id, userId: users.get(demo.user)!.id, role: demo.role }, { transaction });
    }
  });
  return "seeded";
}
