import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      "users",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.STRING(20), allowNull: false },
        password_hash: { type: DataTypes.STRING(100), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addConstraint("users", {
      type: "check",
      fields: ["role"],
      name: "users_role_known",
      where: { role: ["admin", "researcher", "technician", "reviewer", "grower"] },
      transaction,
    });
    await queryInterface.addConstraint("users", {
      type: "check",
      fields: ["email"],
      name: "users_email_lowercase",
      where: queryInterface.sequelize.literal("email = lower(email)") as never,
      transaction,
    });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.dropTable("users");
}
