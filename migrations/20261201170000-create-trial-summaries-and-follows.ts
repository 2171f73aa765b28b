import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      "trial_summaries",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: { type: DataTypes.UUID, allowNull: false, unique: true, references: { model: "trials", key: "id" }, onDelete: "CASCADE" },
        // The researcher's working text; null means "use the generated text".
        edited_text: { type: DataTypes.TEXT, allowNull: true },
        // What growers read once published, and the numbers it was generated from.
        published_text: { type: DataTypes.TEXT, allowNull: true },
        generated_text: { type: DataTypes.TEXT, allowNull: true },
        numbers: { type: DataTypes.JSONB, allowNull: true },
        published_at: { type: DataTypes.DATE, allowNull: true },
        published_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
        updated_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );

    await queryInterface.createTable(
      "follows",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
        kind: { type: DataTypes.STRING(10), allowNull: false },
        // Crops are stored in lower case and methods as their category, so matching is exact.
        value: { type: DataTypes.STRING(80), allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addConstraint("follows", { type: "unique", fields: ["user_id", "kind", "value"], name: "follows_user_kind_value_unique", transaction });
    await queryInterface.addConstraint("follows", { type: "check", fields: ["kind"], where: { kind: ["crop", "method"] }, name: "follows_kind_check", transaction });
    // The mail side looks followers up by what was published.
    await queryInterface.addIndex("follows", ["kind", "value"], { transaction });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable("follows", { transaction });
    await queryInterface.dropTable("trial_summaries", { transaction });
  });
}
