import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

/*
 * One row per reminder sent: assessment, the day it is due, and the person. The daily job
 * inserts it in the transaction that queues the mail, so a run that fails partway and runs
 * again (its day claim is given back) skips everyone already reminded.
 */
export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      "assessment_reminders",
      {
        assessment_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "assessments", key: "id" }, onDelete: "CASCADE" },
        due_date: { type: DataTypes.DATEONLY, primaryKey: true },
        user_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
        created_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    // Deleting a user cascades here; without this index that would scan the whole table.
    await queryInterface.addIndex("assessment_reminders", ["user_id"], { transaction });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable("assessment_reminders", { transaction });
  });
}
