import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

const cascadeTo = (table: string) => ({ type: DataTypes.UUID, allowNull: false, references: { model: table, key: "id" }, onDelete: "CASCADE" }) as const;
const userReference = { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "RESTRICT" } as const;

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      "uploads",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: cascadeTo("trials"),
        assessment_id: cascadeTo("assessments"),
        object_key: { type: DataTypes.STRING(300), allowNull: false, unique: true },
        original_name: { type: DataTypes.STRING(200), allowNull: false },
        declared_size_bytes: { type: DataTypes.BIGINT, allowNull: false },
        size_bytes: { type: DataTypes.BIGINT, allowNull: true },
        sha256: { type: DataTypes.STRING(64), allowNull: true },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "pending" },
        problems: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        row_count: { type: DataTypes.INTEGER, allowNull: true },
        uploaded_by_id: userReference,
        version_id: { type: DataTypes.UUID, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addIndex("uploads", ["assessment_id", "created_at"], { transaction });

    await queryInterface.createTable(
      "dataset_versions",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        assessment_id: cascadeTo("assessments"),
        trial_id: cascadeTo("trials"),
        number: { type: DataTypes.INTEGER, allowNull: false },
        source: { type: DataTypes.STRING(10), allowNull: false },
        upload_id: { type: DataTypes.UUID, allowNull: true, references: { model: "uploads", key: "id" }, onDelete: "SET NULL" },
        created_by_id: userReference,
        reason: { type: DataTypes.TEXT, allowNull: true },
        rows_added: { type: DataTypes.INTEGER, allowNull: false },
        rows_replaced: { type: DataTypes.INTEGER, allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    // Two commits racing for the same assessment cannot both become version N.
    await queryInterface.addConstraint("dataset_versions", {
      type: "unique", fields: ["assessment_id", "number"], name: "dataset_versions_number_unique", transaction,
    });

    await queryInterface.createTable(
      "observations",
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        assessment_id: cascadeTo("assessments"),
        plot_id: cascadeTo("plots"),
        quadrat: { type: DataTypes.INTEGER, allowNull: false },
        species: { type: DataTypes.STRING(80), allowNull: false, defaultValue: "" },
        value: { type: DataTypes.DOUBLE, allowNull: false },
        added_in_version_id: cascadeTo("dataset_versions"),
        replaced_in_version_id: { type: DataTypes.UUID, allowNull: true, references: { model: "dataset_versions", key: "id" }, onDelete: "CASCADE" },
      },
      { transaction },
    );
    await queryInterface.sequelize.query(
      `CREATE UNIQUE INDEX observations_current_unique ON observations (assessment_id, plot_id, quadrat, species)
         WHERE replaced_in_version_id IS NULL`,
      { transaction },
    );
    await queryInterface.addIndex("observations", ["added_in_version_id"], { transaction });
    await queryInterface.addIndex("observations", ["replaced_in_version_id"], { transaction });

    await queryInterface.createTable(
      "audit_events",
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        trial_id: cascadeTo("trials"),
        user_id: userReference,
        entity_type: { type: DataTypes.STRING(40), allowNull: false },
        entity_id: { type: DataTypes.STRING(80), allowNull: false },
        action: { type: DataTypes.STRING(10), allowNull: false },
        summary: { type: DataTypes.STRING(500), allowNull: false },
        old_value: { type: DataTypes.JSONB, allowNull: true },
        new_value: { type: DataTypes.JSONB, allowNull: true },
        source: { type: DataTypes.STRING(80), allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: true },
        after_lock: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addIndex("audit_events", ["trial_id", "created_at"], { transaction });

    await queryInterface.createTable(
      "photos",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: cascadeTo("trials"),
        plot_id: cascadeTo("plots"),
        assessment_id: { type: DataTypes.UUID, allowNull: true, references: { model: "assessments", key: "id" }, onDelete: "SET NULL" },
        object_key: { type: DataTypes.STRING(300), allowNull: false, unique: true },
        thumbnail_key: { type: DataTypes.STRING(300), allowNull: false },
        content_type: { type: DataTypes.STRING(40), allowNull: false },
        size_bytes: { type: DataTypes.INTEGER, allowNull: false },
        caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: "" },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "pending" },
        uploaded_by_id: userReference,
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addIndex("photos", ["plot_id"], { transaction });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    for (const table of ["photos", "audit_events", "observations", "dataset_versions", "uploads"]) {
      await queryInterface.dropTable(table, { transaction });
    }
  });
}
