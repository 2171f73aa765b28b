import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      "memberships",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
        trial_id: { type: DataTypes.UUID, allowNull: false, references: { model: "trials", key: "id" }, onDelete: "CASCADE" },
        role: { type: DataTypes.STRING(20), allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addConstraint("memberships", {
      type: "unique", fields: ["user_id", "trial_id"], name: "memberships_one_per_user_and_trial", transaction,
    });
    await queryInterface.addConstraint("memberships", {
      type: "check", fields: ["role"], name: "memberships_role_known",
      where: { role: ["technician", "reviewer"] }, transaction,
    });
    await queryInterface.addIndex("memberships", ["trial_id"], { transaction });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.dropTable("memberships");
}
