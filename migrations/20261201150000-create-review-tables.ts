import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

const cascadeTo = (table: string, allowNull = false) => ({ type: DataTypes.UUID, allowNull, references: { model: table, key: "id" }, onDelete: "CASCADE" }) as const;
const userReference = (allowNull = false) => ({ type: DataTypes.UUID, allowNull, references: { model: "users", key: "id" }, onDelete: "RESTRICT" }) as const;

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    // A request for review and its outcome; the newest row of a trial is its review status.
    await queryInterface.createTable(
      "review_requests",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: cascadeTo("trials"),
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "requested" },
        requested_by_id: userReference(),
        message: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        decided_by_id: userReference(true),
        decided_at: { type: DataTypes.DATE, allowNull: true },
        decision_note: { type: DataTypes.TEXT, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addIndex("review_requests", ["trial_id", "created_at"], { transaction });
    // Only one open request per trial.
    await queryInterface.sequelize.query(
      "CREATE UNIQUE INDEX review_requests_one_open ON review_requests (trial_id) WHERE status = 'requested'",
      { transaction },
    );

    await queryInterface.createTable(
      "review_comments",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: cascadeTo("trials"),
        assessment_id: cascadeTo("assessments", true),
        parent_id: { type: DataTypes.UUID, allowNull: true, references: { model: "review_comments", key: "id" }, onDelete: "CASCADE" },
        author_id: userReference(),
        body: { type: DataTypes.TEXT, allowNull: false },
        resolved_at: { type: DataTypes.DATE, allowNull: true },
        resolved_by_id: userReference(true),
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addIndex("review_comments", ["trial_id", "created_at"], { transaction });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable("review_comments", { transaction });
    await queryInterface.dropTable("review_requests", { transaction });
  });
}
